import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Study } from '@shared/schemas';
import { StudyRelease } from './study-release';

async function show(release: Study['release']) {
  TestBed.configureTestingModule({ providers: [provideRouter([])] });
  const fixture = TestBed.createComponent(StudyRelease);
  fixture.componentRef.setInput('release', release);
  await fixture.whenStable();
  return (fixture.nativeElement as HTMLElement).querySelector('[data-testid="study-release"]');
}

describe('StudyRelease', () => {
  it('names the release and the requirement the study meets there, linking to the release', async () => {
    const line = await show({ id: 7, title: 'Glucose lot 24-117 on line 2', requirement: 'Method comparison' });
    expect(line?.textContent?.replace(/\s+/g, ' ').trim()).toBe('rocket_launch Part of release Glucose lot 24-117 on line 2 (Method comparison)');
    expect(line?.querySelector('a')?.getAttribute('href')).toBe('/releases/7');
  });

  it('shows nothing for a study that belongs to no release', async () => {
    expect(await show(null)).toBeNull();
  });
});
