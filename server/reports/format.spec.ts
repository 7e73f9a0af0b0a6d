import * as shared from '@shared/format/number-format';
import { chance, integer, num, percent, pValue, range, withCi } from './format';
import { share } from './sections/sample-plan';
import { laboratoryTime, utcOffset } from '@shared/types/lab-time';

describe('report number formats', () => {
  it('prints a true minus sign and no sign on a rounded zero', () => {
    expect(num(-0.071, 2)).toBe('−0.07');
    expect(num(-0.001, 2)).toBe('0.00');
    expect(num(1.25, 1)).toBe('1.3');
    expect(num(null, 2)).toBe('—');
    expect(num(Number.NaN, 2)).toBe('—');
  });

  it('prints intervals, estimates with CIs, p-values and levels', () => {
    expect(range([-0.19, 0.08], 2)).toBe('−0.19 to 0.08');
    expect(withCi({ estimate: 0.5, ci: [0.3, 0.6] }, 2)).toBe('0.50 (0.30 to 0.60)');
    expect(withCi({ estimate: null, ci: null }, 2)).toBe('— (CI not available)');
    expect(withCi({ estimate: 0.5, ci: [0.3, 0.6] }, 2, 'mmol/L')).toBe('0.50 mmol/L (0.30 to 0.60)');
    expect(range(null, 2)).toBe('not available');
    expect(pValue(0.0004)).toBe('< 0.001');
    expect(pValue(0.0431)).toBe('0.043');
    expect(percent(0.95)).toBe('95%');
    expect(percent(0.975)).toBe('97.5%');
  });

  it('writes shares, chances and counts by the one shared rule the screen uses (shared/format/number-format.ts)', () => {
    expect([percent(0.0125), percent(0.9995), percent(null)]).toEqual(['1.25%', '99.95%', '—']);
    expect([chance(0.677), chance(0.37), chance(0.9996), chance(0.0004)]).toEqual(['67.7%', '37.0%', '> 99.9%', '< 0.1%']);
    expect([integer(2000), integer(19.6), integer(null)]).toEqual(['2,000', '20', '—']);
    for (const p of [0.677, 0.9996, 0.0004, 0.92049]) expect([share(p), chance(p)]).toEqual([shared.formatChance(p), shared.formatChance(p)]);
    for (const f of [0.95, 0.0125, 0.12345]) expect(percent(f)).toBe(shared.formatPercent(f));
  });
});

describe("times in the laboratory's zone", () => {
  it('names the zone and the offset in force, summer time included', () => {
    expect(laboratoryTime(new Date('2026-12-02T13:14:00Z'), 'America/Halifax')).toBe('2026-12-02 09:14 America/Halifax (UTC−04:00)');
    expect(laboratoryTime(new Date('2026-07-02T13:14:00Z'), 'America/Halifax')).toBe('2026-07-02 10:14 America/Halifax (UTC−03:00)');
    expect(laboratoryTime(new Date('2026-12-31T23:30:00Z'), 'Asia/Kolkata')).toBe('2027-01-01 05:00 Asia/Kolkata (UTC+05:30)');
    expect(utcOffset(new Date('2026-12-02T00:00:00Z'), 'UTC')).toBe('UTC+00:00');
  });
});
