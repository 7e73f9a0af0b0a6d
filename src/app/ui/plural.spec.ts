import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { PluralPipe } from './plural';

@Component({
  template: `<p>{{ rows() | plural: 'row' }}; {{ studies() | plural: 'study' : 'studies' }}</p>`,
  imports: [PluralPipe],
})
class Counts {
  readonly rows = signal(1);
  readonly studies = signal(1);
}

describe('PluralPipe', () => {
  it('writes the singular for one and the plural for other counts, and follows the count as it changes', async () => {
    const fixture = TestBed.createComponent(Counts);
    await fixture.whenStable();
    const text = () => (fixture.nativeElement as HTMLElement).textContent?.trim();
    expect(text()).toBe('1 row; 1 study');
    fixture.componentInstance.rows.set(3);
    fixture.componentInstance.studies.set(0);
    await fixture.whenStable();
    expect(text()).toBe('3 rows; 0 studies');
  });

  it('counts a missing number as none', () => {
    expect(new PluralPipe().transform(null, 'outlier')).toBe('0 outliers');
  });
});
