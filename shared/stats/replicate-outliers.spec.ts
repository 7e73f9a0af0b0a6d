import { oneWayAnova } from './one-way-anova';
import { flagReplicates, type ReplicateDay } from './replicate-outliers';

// Two days of five: without the far 5.40 the results scatter with s_r = 0.0239 (limit 5.5·s_r = 0.13).
const grid = [[5.02, 5.05, 4.98, 5.01, 5.04], [5.10, 5.07, 5.40, 5.08, 5.11]];
const days = (values = grid): ReplicateDay[] => values.map((v, d) => ({
  day: `2026-03-0${d + 2}`,
  results: v.map((value, r) => ({ value, replicate: r + 1, position: d * 5 + r + 1 })),
}));

describe('replicates far from the rest of their day', () => {
  it('flags |x − mean of the day\'s other results| > 5.5·s_r without x, with day, replicate, value, position and why', () => {
    const without = oneWayAnova([grid[0], [5.10, 5.07, 5.08, 5.11]]);
    const sr = Math.sqrt(without.msWithin);
    const flagged = flagReplicates(days(), 5.5);
    expect(flagged).toHaveLength(1);
    expect(flagged[0]).toMatchObject({ position: 8, day: '2026-03-03', replicate: 3, value: 5.4 });
    expect(flagged[0].why).toBe(`5.4 lies 0.31 from the mean of the other results of day 2026-03-03 (5.09), more than 5.5 × s_r = ${Number((5.5 * sr).toPrecision(4))} (s_r without this result: ${Number(sr.toPrecision(4))})`);
  });

  it('catches what the rule with x kept in s_r cannot: there one result reaches at most 4·s_r in a 5 × 5 design', () => {
    const far = [[5.02, 5.05, 4.98, 5.01, 5.04], [5.10, 5.07, 9.0, 5.08, 5.11], [4.97, 5.00, 4.95, 4.99, 4.98], [5.04, 5.06, 5.03, 5.07, 5.05], [5.01, 4.99, 5.03, 5.00, 5.02]];
    const a = oneWayAnova(far);
    expect(Math.abs(9.0 - a.groupMeans[1]) / Math.sqrt(a.msWithin)).toBeLessThan(4);
    expect(flagReplicates(days(far), 5.5).map((f) => f.value)).toEqual([9.0]);
  });

  it('uses the factor given', () => {
    expect(flagReplicates(days(), 50)).toEqual([]);
    expect(flagReplicates(days(), 5.5)).toHaveLength(1);
  });

  it('takes s_r no smaller than the rounding SD h/√12 for coarse results', () => {
    const coarse = [[140, 140, 140], [140, 141, 140], [140, 140, 140]];
    expect(flagReplicates(days(coarse), 5.5, 0)).toHaveLength(1); // s_r without 141 is 0
    expect(flagReplicates(days(coarse), 5.5, 1)).toEqual([]); // 1 ≤ 5.5/√12 = 1.59
    const jump = [[140, 140, 140], [140, 142, 140], [140, 140, 140]];
    const flagged = flagReplicates(days(jump), 5.5, 1);
    expect(flagged).toHaveLength(1);
    expect(flagged[0].why).toContain('no smaller than the rounding SD h/√12');
  });

  it('does not judge a result alone on its day', () => {
    expect(flagReplicates([{ day: '1', results: [{ value: 99, replicate: 1 }] }, ...days()], 5.5).map((f) => f.value)).toEqual([5.4]);
  });

  it('refuses a factor that is not positive or a negative step', () => {
    expect(() => flagReplicates(days(), 0)).toThrow(RangeError);
    expect(() => flagReplicates(days(), 5.5, -1)).toThrow(RangeError);
  });
});
