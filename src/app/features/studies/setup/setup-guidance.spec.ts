import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { StudyStore } from '../study/study-store';
import { SetupForm } from './setup-form';

/** A new study's Setup form with the given kind chosen. */
async function newStudyOf(kind: string | null) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, provideSession(sessionUser(['technologist'])), StudyStore] });
  await restoreSession();
  const fixture = TestBed.createComponent(SetupForm);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/analytes').flush([]);
  httpController().expectOne('/api/v1/instruments').flush([]);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  if (kind) {
    const select = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="setup-kind"]' }));
    await select.open();
    await select.clickOptions({ text: kind });
    await fixture.whenStable();
  }
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? null;
  const label = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.closest('mat-form-field')?.querySelector('mat-label')?.textContent?.trim() ?? null;
  const present = (id: string) => el.querySelector(`[data-testid="${id}"]`) !== null;
  return { text, label, present };
}

describe('Setup guidance per kind of study', () => {
  afterEach(() => httpController().verify());

  it('tells a method comparison to plan 40 specimens across the range and shows all four bootstrap settings', async () => {
    const { text, label, present } = await newStudyOf(null);
    expect(label('setup-planned')).toBe('Planned specimens');
    expect(text('setup-planned-hint')).toBe('At least 40 patient specimens across the measuring range, covering the decision levels (CLSI EP09 practice).');
    expect(text('setup-analyte-hint')).toBe('Brings its unit, decision levels and allowable bias; you may change them for this study.');
    expect([present('setup-level'), present('setup-interval'), present('setup-resamples'), present('setup-seed')]).toEqual([true, true, true, true]);
    expect(present('setup-analysis-note')).toBe(false);
  });

  it('tells an establishment 120 healthy individuals per partition and shows only the settings of the limits’ bootstrap', async () => {
    const { text, label, present } = await newStudyOf('Reference interval: establish');
    expect(label('setup-planned')).toBe('Planned reference individuals');
    expect(text('setup-planned-hint')).toBe(
      'At least 120 healthy reference individuals per partition (CLSI EP28-A3c practice); a sex or age band with limits of its own needs its 120.',
    );
    expect(text('setup-analyte-hint')).toBe('Brings its unit and decimals; you may change them for this study.');
    expect(text('setup-planned-hint')).not.toContain('40');
    expect(label('setup-level')).toBe('Confidence level of the limits');
    expect([present('setup-level'), present('setup-resamples'), present('setup-seed')]).toEqual([true, true, true]);
    expect(present('setup-interval')).toBe(false);
    expect(text('setup-analysis-note')).toMatch(/^Each limit's CI is a percentile bootstrap at this level/);
  });

  it('tells a verification 20 individuals with at most 2 outside, and shows no bootstrap settings it does not use', async () => {
    const { text, label, present } = await newStudyOf('Reference interval: verify');
    expect(label('setup-planned')).toBe('Planned reference individuals');
    expect(text('setup-planned-hint')).toBe(
      '20 local healthy individuals; the stated interval is accepted when at most 2 of them fall outside it (CLSI EP28-A3c practice).',
    );
    expect(text('setup-analyte-hint')).toBe('Brings its unit and decimals; you may change them for this study.');
    expect(present('setup-bootstrap')).toBe(false);
    expect([present('setup-level'), present('setup-interval'), present('setup-resamples'), present('setup-seed')]).toEqual([false, false, false, false]);
    expect(text('setup-analysis-note')).toBe(
      'The findings count the values outside the stated interval; there is no bootstrap, so no confidence level, resamples or seed to set.',
    );
  });
});
