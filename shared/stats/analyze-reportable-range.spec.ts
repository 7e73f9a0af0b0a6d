import { RANGE_DEMO_ROWS, RANGE_DEMO_SETTINGS } from '../kinds/reportable-range/demo-data';
import { analyzeReportableRange, longestRun } from './analyze-reportable-range';
import { fitPolynomial } from './polynomial-fit';
import type { RangeOptions, RangeRow } from './reportable-range-types';

const demo = { rows: RANGE_DEMO_ROWS, settings: RANGE_DEMO_SETTINGS };
const demoRows = (): RangeRow[] => demo.rows.map((r) => ({ level: String(r.level), replicate: Number(r.replicate), value: Number(r.value) }));
const demoOptions = (): RangeOptions => ({ ...(demo.settings as unknown as RangeOptions), unit: 'mmol/L', resamples: 2000 });

/** Levels at x = 1..k, each with the results given. */
function design(values: number[][], more: Partial<RangeOptions> = {}): { rows: RangeRow[]; options: RangeOptions } {
  const levels = values.map((_, i) => ({ name: `L${i + 1}`, assigned: (i + 1) * 10 }));
  const rows = values.flatMap((vs, i) => vs.map((value, j) => ({ level: `L${i + 1}`, replicate: j + 1, value })));
  return { rows, options: { levels, allowableNonlinearity: 1, resamples: 1000, seed: 't', decimals: 2, ...more } };
}

describe('analyzeReportableRange', () => {
  it('finds the demo\'s bent top: the cubic fits best and the verified range ends one level short of the top', () => {
    const r = analyzeReportableRange(demoRows(), demoOptions());
    expect(r.kind).toBe('reportable-range');
    expect(r.basis).toBe('assigned');
    expect(r.levels.map((l) => l.x)).toEqual([0.3, 4.3, 8.3, 12.3, 16.3, 20.3, 24.3, 28.3, 32.3]);
    expect(r.bestDegree).toBe(3);
    expect(r.fits.map((f) => f.degree)).toEqual([1, 2, 3]);
    expect(r.fits[2].significant).toBe(true);
    expect(r.levels.map((l) => l.within)).toEqual([true, true, true, true, true, true, true, true, false]);
    expect(r.verifiedRange).toEqual({ low: 0.3, high: 28.3, lowLevel: 'Level 1', highLevel: 'Level 8' });
    expect(r.verdict).toBe('range-shortened');
    expect(r.coversClaim).toBe(false);
    expect(r.verdictWords).toBe('Shortened: the deviation from linearity exceeds the allowable nonlinearity at level "Level 9"; the reportable range is verified only from 0.30 to 28.30 mmol/L (levels "Level 1" to "Level 8"). It does not reach the claimed high end (32.00 mmol/L).');
    const top = r.levels[8];
    expect(top.deviation).toBeLessThan(-0.5);
    expect(top.deviationCi![1]).toBeLessThan(-0.5);
    // 1.5% of about 31.6 is 0.47: the absolute 0.5 is the larger goal at every level
    expect(r.levels.every((l) => l.goal === 0.5)).toBe(true);
    expect(r.caution).toMatch(/Decision support only/);
    expect(r.engine).toMatchObject({ resamples: 2000, seed: 'vh-glucose-range-2026' });
  });

  it('takes the deviation as best fit minus straight line at each level, both least-squares fits of every included result', () => {
    const r = analyzeReportableRange(demoRows(), demoOptions());
    const x = r.levels.flatMap((l) => l.values.map(() => l.x));
    const y = r.levels.flatMap((l) => l.values);
    const line = fitPolynomial(x, y, 1).coefficients;
    const cubic = fitPolynomial(x, y, 3).coefficients;
    for (const l of r.levels) {
      const lin = line[0] + line[1] * l.x;
      const cub = cubic[0] + cubic[1] * l.x + cubic[2] * l.x ** 2 + cubic[3] * l.x ** 3;
      expect(l.linear).toBeCloseTo(lin, 9);
      expect(l.fitted).toBeCloseTo(cub, 9);
      expect(l.deviation).toBeCloseTo(cub - lin, 9);
      expect(l.deviationPercent).toBeCloseTo((100 * (cub - lin)) / Math.abs(lin), 7);
      expect(l.recoveryPercent).toBeCloseTo((100 * l.mean) / l.x, 9);
      expect(l.deviationCi![0]).toBeLessThanOrEqual(l.deviation + 1e-9);
      expect(l.deviationCi![1]).toBeGreaterThanOrEqual(l.deviation - 1e-9);
    }
  });

  it('keeps the straight line when no top coefficient differs from 0: no deviation, no resampling, every level verified', () => {
    const { rows, options } = design([[10.1, 9.9], [20.05, 19.95], [30.1, 29.9], [40, 40.1], [49.9, 50.1]]);
    const r = analyzeReportableRange(rows, options);
    expect(r.bestDegree).toBe(1);
    expect(r.fits.map((f) => f.significant)).toEqual([false, false, false]);
    expect(r.levels.every((l) => l.deviation === 0 && l.deviationCi === null && l.within)).toBe(true);
    expect(r.verdict).toBe('range-verified');
    expect(r.verifiedRange).toMatchObject({ low: 10, high: 50 });
    expect(r.engine.resamples).toBe(0);
    expect(r.verdictWords).toMatch(/^Verified: at all 5 levels/);
  });

  it('keeps the quadratic for a smooth bend, and says nothing is verified when every deviation exceeds the goal', () => {
    const bend = (x: number) => x - 0.004 * x * x;
    const values = [1, 2, 3, 4, 5, 6, 7].map((i) => [bend(i * 10) + 0.01, bend(i * 10) - 0.01]);
    const r = analyzeReportableRange(design(values, { allowableNonlinearity: 0.01 }).rows, design(values, { allowableNonlinearity: 0.01 }).options);
    expect(r.bestDegree).toBe(2);
    expect(r.fits[1].p).toBeLessThan(1e-6);
    expect(r.fits[2].significant).toBe(false);
    // quadratic minus line is a parabola: negative at both ends, positive in the middle
    expect(r.levels[0].deviation).toBeLessThan(0);
    expect(r.levels[3].deviation).toBeGreaterThan(0);
    expect(r.levels[6].deviation).toBeLessThan(0);
    // only the levels near the parabola's two zeros are within 0.01
    expect(r.levels.map((l) => l.within)).toEqual(r.levels.map((l) => Math.abs(l.deviation) <= 0.01));
    const none = analyzeReportableRange(demoRows(), { ...demoOptions(), allowableNonlinearity: 0.005, allowableNonlinearityPercent: null });
    expect(none.levels.some((l) => l.within)).toBe(false);
    expect(none.verdict).toBe('range-not-verified');
    expect(none.verifiedRange).toBeNull();
    expect(none.verdictWords).toBe('Not verified: at no level does the deviation from linearity lie within the allowable nonlinearity.');
  });

  it('judges each level against the larger of the absolute and the % goal, and picks the longest run', () => {
    expect(longestRun([true, false, true, true, false, true, true])).toEqual([2, 3]);
    expect(longestRun([false, false])).toBeNull();
    expect(longestRun([true, true, false, true])).toEqual([0, 1]);
    const r = analyzeReportableRange(demoRows(), { ...demoOptions(), allowableNonlinearity: 0.1, allowableNonlinearityPercent: 2 });
    for (const l of r.levels) expect(l.goal).toBeCloseTo(Math.max(0.1, 0.02 * Math.abs(l.linear)), 12);
    const within = r.levels.map((l) => Math.abs(l.deviation) <= l.goal);
    expect(r.levels.map((l) => l.within)).toEqual(within);
    const run = longestRun(within)!;
    expect(r.verifiedRange).toMatchObject({ lowLevel: r.levels[run[0]].level, highLevel: r.levels[run[1]].level });
  });

  it('fits against the fraction when every level is a mixture and no pool values are given: no recovery, the range as mean results', () => {
    const levels = [0, 0.25, 0.5, 0.75, 1].map((f, i) => ({ name: `M${i}`, fraction: f }));
    const rows = levels.flatMap((l) => [1, 2].map((rep) => ({ level: l.name, replicate: rep, value: 2 + 40 * l.fraction + (rep === 1 ? 0.05 : -0.05) })));
    const r = analyzeReportableRange(rows, { levels, allowableNonlinearityPercent: 5, resamples: 1000 });
    expect(r.basis).toBe('fraction');
    expect(r.levels.map((l) => [l.x, l.assigned, l.recoveryPercent])).toEqual([[0, null, null], [0.25, null, null], [0.5, null, null], [0.75, null, null], [1, null, null]]);
    expect(r.verifiedRange).toMatchObject({ low: 2, high: 42, lowLevel: 'M0', highLevel: 'M4' });
    expect(r.coversClaim).toBeNull();
  });

  it('derives assigned values from the pools, exactly as a person would write them', () => {
    const levels = [0, 0.25, 0.5, 0.75, 1].map((f, i) => ({ name: `M${i}`, fraction: f }));
    const rows = levels.flatMap((l) => [1, 2].map((rep) => ({ level: l.name, replicate: rep, value: 0.3 + 35.7 * l.fraction + rep / 100 })));
    const r = analyzeReportableRange(rows, { levels, poolLow: 0.3, poolHigh: 36, allowableNonlinearity: 0.5, resamples: 1000 });
    expect(r.levels.map((l) => l.assigned)).toEqual([0.3, 9.225, 18.15, 27.075, 36]);
  });

  it('refuses options and rows in words naming the option, the level and the row', () => {
    const { rows, options } = design([[10], [20], [30], [40], [50]]);
    expect(() => analyzeReportableRange(rows, { ...options, allowableNonlinearity: null })).toThrow('option allowableNonlinearity is not set: give the allowable nonlinearity in the unit or in % (or both) before running the analysis');
    expect(() => analyzeReportableRange([...rows, { level: 'L9', replicate: 1, value: 3, position: 12 }], options)).toThrow('option levels do not list level "L9", named at row 12; add it to the settings or correct the row');
    expect(() => analyzeReportableRange(rows, { ...options, levels: [{ name: 'A', assigned: 1, fraction: 0.5 }] })).toThrow('option levels "A" needs either an assigned value or a mixing fraction, not both');
    expect(() => analyzeReportableRange(rows, { ...options, levels: [{ name: 'A', assigned: 1 }, { name: 'B', fraction: 0.5 }] })).toThrow(/option poolLow and poolHigh are needed/);
    expect(() => analyzeReportableRange(rows, { ...options, levels: [{ name: 'A', assigned: 1 }, { name: 'a', assigned: 2 }] })).toThrow('option levels names "a" twice; each level is listed once');
    expect(() => analyzeReportableRange([{ level: 'L1', replicate: 1, value: Number.NaN, position: 4 }], options)).toThrow('analyzeReportableRange requires finite values (row 4)');
    const two = design([[10, 10.1], [20, 20.1]]);
    expect(() => analyzeReportableRange(two.rows, two.options)).toThrow(/have results at 2 distinct values: a straight line and its error need at least 3 levels/);
  });

  it('counts excluded rows without using them, and leaves out a level whose results are all excluded', () => {
    const { rows, options } = design([[10, 10.1], [20, 20.1], [30, 30.2], [40, 40.1], [50, 49.9], [60, 60.1]]);
    const marked = rows.map((r) => (r.level === 'L6' || (r.level === 'L2' && r.replicate === 2) ? { ...r, excluded: true, exclusionReason: 'clot' } : r));
    const r = analyzeReportableRange(marked, options);
    expect(r.excludedCount).toBe(3);
    expect(r.levels.map((l) => l.level)).toEqual(['L1', 'L2', 'L3', 'L4', 'L5']);
    expect(r.levels[1].n).toBe(1);
    expect(r.warnings).toContain('Level "L6" has no included results, so it is not analysed.');
    expect(r.warnings).toContain('Level "L2" (1) has fewer results than the 2 planned.');
  });

  it('warns of too few levels, a degree it cannot fit, a response that turns back, and a level that scatters', () => {
    const few = design([[10, 10.1], [20, 20.2], [30, 30.1], [40, 40.2]]);
    const r = analyzeReportableRange(few.rows, few.options);
    expect(r.fits.map((f) => f.degree)).toEqual([1, 2]);
    expect(r.warnings).toContain('With results at 4 levels the polynomial of degree 3 is not fitted (it needs 5).');
    expect(r.warnings).toContain('Only 4 levels have results; CLSI EP06 practice asks for 5 to 11 across the claimed interval.');
    const turning = design([[10, 10.1], [20, 20.2], [30, 30.1], [29, 29.2], [50, 50.1]]);
    expect(analyzeReportableRange(turning.rows, turning.options).warnings).toContain('The response is not monotone: the mean result does not rise from "L3" to "L4".');
    const scatter = design([[10, 10.01], [20, 20.02], [30, 31.5], [40, 40.01], [50, 50.02], [60, 60.01], [70, 70.02]]);
    const s = analyzeReportableRange(scatter.rows, scatter.options);
    expect(s.scatterFlag).toMatchObject({ level: 'L3' });
    expect(s.scatterFlag!.c).toBeGreaterThan(s.scatterFlag!.critical);
    expect(s.warnings.some((w) => w.startsWith('Level "L3" has the largest replicate scatter by Cochran\'s test'))).toBe(true);
    expect(analyzeReportableRange(demoRows(), demoOptions()).scatterFlag).toBeNull();
  });

  it('says where the levels do not reach the claimed interval', () => {
    const { rows, options } = design([[10, 10.1], [20, 20.2], [30, 30.1], [40, 40.2], [50, 50.1]], { claimedLow: 5, claimedHigh: 45, unit: 'U/L' });
    const r = analyzeReportableRange(rows, options);
    expect(r.warnings).toContain('The lowest level (10.00 U/L) lies above the claimed low end (5.00 U/L): the range below it is not tested.');
    expect(r.coversClaim).toBe(false);
    expect(r.verdictWords).toMatch(/It does not reach the claimed low end \(5\.00 U\/L\)\.$/);
  });

  it('flags a level within the goal whose CI reaches beyond it', () => {
    const r = analyzeReportableRange(demoRows(), { ...demoOptions(), allowableNonlinearity: 0.39 });
    const edge = r.levels.filter((l) => l.ciBeyondGoal);
    expect(edge.length).toBeGreaterThan(0);
    for (const l of edge) expect(l.within && (l.deviationCi![0] < -l.goal || l.deviationCi![1] > l.goal)).toBe(true);
    expect(r.warnings.some((w) => w.includes('is within the goal but its CI reaches beyond it'))).toBe(true);
  });

  it('is reproducible from its seed, and another seed draws other resamples', () => {
    const a = analyzeReportableRange(demoRows(), demoOptions());
    const b = analyzeReportableRange(demoRows(), demoOptions());
    const c = analyzeReportableRange(demoRows(), { ...demoOptions(), seed: 'other' });
    expect(b).toEqual(a);
    expect(c.levels.map((l) => l.deviation)).toEqual(a.levels.map((l) => l.deviation));
    expect(c.levels.map((l) => l.deviationCi)).not.toEqual(a.levels.map((l) => l.deviationCi));
  });

  it('reports its progress up to 1', () => {
    const seen: number[] = [];
    analyzeReportableRange(demoRows(), demoOptions(), (f) => seen.push(f));
    expect(seen.length).toBeGreaterThan(10);
    expect(seen[seen.length - 1]).toBe(1);
    expect([...seen].sort((p, q) => p - q)).toEqual(seen);
  });
});
