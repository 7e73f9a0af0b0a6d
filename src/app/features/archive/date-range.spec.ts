import { FormControl, FormGroup } from '@angular/forms';
import { datesInOrder, rangeBackwards } from './date-range';

const form = (values: Record<string, string>) =>
  new FormGroup(
    Object.fromEntries(Object.entries(values).map(([k, v]) => [k, new FormControl(v)])),
    { validators: [datesInOrder('aFrom', 'aTo'), datesInOrder('bFrom', 'bTo')] },
  );

describe('datesInOrder', () => {
  it('accepts a range in order, a one-day range and an open end', () => {
    const group = form({ aFrom: '2026-01-01', aTo: '2026-01-31', bFrom: '2026-02-02', bTo: '2026-02-02' });
    expect(group.valid).toBe(true);
    group.patchValue({ aTo: '' });
    expect(group.valid).toBe(true);
  });

  it('names each range that runs backwards, both at once', () => {
    const group = form({ aFrom: '2026-02-01', aTo: '2026-01-31', bFrom: '2026-03-01', bTo: '2025-01-01' });
    expect(group.valid).toBe(false);
    expect(rangeBackwards(group, 'aFrom')).toBe(true);
    expect(rangeBackwards(group, 'bFrom')).toBe(true);
    group.patchValue({ bTo: '2026-12-31' });
    expect(rangeBackwards(group, 'aFrom')).toBe(true);
    expect(rangeBackwards(group, 'bFrom')).toBe(false);
  });
});
