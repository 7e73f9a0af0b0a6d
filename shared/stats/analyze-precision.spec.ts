import { analyzePrecision } from './analyze-precision';
import { CAUTION } from './comparison-types';
import { oneWayAnova } from './one-way-anova';
import { DEFAULT_SEED, OptionError } from './options';
import { precisionComponents } from './precision-components';
import type { PrecisionMaterialSetting, PrecisionOptions, PrecisionRow } from './precision-types';
import { upperVerificationLimit } from './precision-verification';

// An invented 5 × 5 study of two materials (Low near 5, High near 15), days 2026-03-02 … 2026-03-06.
const DAYS = ['2026-03-02', '2026-03-03', '2026-03-04', '2026-03-05', '2026-03-06'];
const LOW = [
  [5.02, 5.05, 4.98, 5.01, 5.04], [5.10, 5.07, 5.12, 5.08, 5.11], [4.97, 5.00, 4.95, 4.99, 4.98],
  [5.04, 5.06, 5.03, 5.07, 5.05], [5.01, 4.99, 5.03, 5.00, 5.02],
];
const HIGH = [
  [15.1, 15.3, 14.9, 15.2, 15.0], [15.2, 15.4, 15.1, 15.3, 15.2], [14.8, 15.0, 14.9, 15.1, 14.9],
  [15.0, 15.2, 15.1, 14.9, 15.3], [15.2, 15.1, 15.0, 15.3, 15.1],
];

function rowsOf(material: string, grid: number[][], start = 1, days = DAYS): PrecisionRow[] {
  return grid.flatMap((values, d) => values.map((value, r) => ({ material, day: days[d], replicate: r + 1, value, position: start + d * values.length + r })));
}
const low: PrecisionMaterialSetting = { name: 'Low', claimRepeatability: 0.03, claimWithinLab: 0.05, claimAs: 'sd', assignedValue: 5.0, assignedUncertainty: 0.02, assignedSource: 'EQA material, peer mean' };
const high: PrecisionMaterialSetting = { name: 'High', claimRepeatability: 0.8, claimWithinLab: 1.2, claimAs: 'cv' };
const both = (): PrecisionRow[] => [...rowsOf('Low', LOW), ...rowsOf('High', HIGH, 26)];
const options = (extra: Partial<PrecisionOptions> = {}): PrecisionOptions => ({ materials: [low, high], ...extra });

function thrown(f: () => unknown): Error {
  try { f(); } catch (e) { return e as Error; }
  throw new Error('expected an error');
}

describe('analyzePrecision', () => {
  it('returns every field of the contract, per material in the order of the settings', () => {
    const result = analyzePrecision([...rowsOf('High', HIGH, 26), ...rowsOf('Low', LOW)], options());
    expect(Object.keys(result).sort()).toEqual(['alpha', 'caution', 'engine', 'excludedCount', 'kind', 'materials', 'materialsTested', 'resolution', 'warnings'].sort());
    expect(result).toMatchObject({ kind: 'precision', alpha: 0.05, materialsTested: 2, excludedCount: 0, caution: CAUTION });
    expect(result.engine).toMatchObject({ seed: DEFAULT_SEED, resamples: 0 });
    expect(result.resolution).toEqual({ increment: 0.01, source: 'data', limitedEstimates: [] });
    expect(result.materials.map((m) => m.name)).toEqual(['Low', 'High']);
    const m = result.materials[0];
    expect(Object.keys(m).sort()).toEqual(['anova', 'betweenDay', 'byDay', 'claims', 'days', 'mean', 'n', 'name', 'notes', 'outliers', 'repeatability', 'trueness', 'uvl', 'verdicts', 'withinLab'].sort());
    expect(Object.keys(m.anova).sort()).toEqual(['balanced', 'dfBetween', 'dfWithin', 'msBetween', 'msWithin', 'n0']);
    expect(Object.keys(m.repeatability).sort()).toEqual(['ci', 'cv', 'df', 'sd']);
    expect(Object.keys(m.withinLab).sort()).toEqual(['ci', 'cv', 'df', 'sd']);
    expect(Object.keys(m.betweenDay).sort()).toEqual(['cv', 'sd']);
    expect(m.trueness).not.toBeNull();
    expect(Object.keys(m.trueness!).sort()).toEqual(['assigned', 'bias', 'biasPercent', 'df', 'interval', 'multiplier', 'se', 'seDf', 'source', 'uncertainty', 'verdict']);
    expect(result.materials[1].trueness).toBeNull();
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });

  it('computes each material from its own included results with the building blocks', () => {
    const result = analyzePrecision(both(), options());
    const m = result.materials[0];
    const a = oneWayAnova(LOW);
    const c = precisionComponents(a);
    expect(m).toMatchObject({ n: 25, days: 5, anova: { msBetween: a.msBetween, msWithin: a.msWithin, dfBetween: 4, dfWithin: 20, n0: 5, balanced: true } });
    expect(m.mean).toBeCloseTo(5.0308, 12);
    expect(m.repeatability.sd).toBe(c.repeatability.sd);
    expect(m.repeatability.df).toBe(20);
    expect(m.betweenDay.sd).toBe(c.betweenDay.sd);
    expect(m.withinLab.sd).toBe(c.withinLab.sd);
    expect(m.withinLab.df).toBe(c.withinLab.df);
    expect(m.repeatability.cv).toBeCloseTo((100 * c.repeatability.sd) / 5.0308, 12);
    expect(m.repeatability.ci.lower).toBeLessThan(m.repeatability.sd);
    expect(m.repeatability.ci.upper).toBeGreaterThan(m.repeatability.sd);
    expect(m.uvl.repeatability).toBeCloseTo(upperVerificationLimit(0.03, 20, 0.05, 2), 14);
    expect(m.claims).toEqual({ repeatability: 0.03, withinLab: 0.05, as: 'sd' });
    expect(m.byDay.map((d) => d.day)).toEqual(DAYS);
    expect(m.byDay[1]).toEqual({ day: '2026-03-03', values: [5.1, 5.07, 5.12, 5.08, 5.11], mean: a.groupMeans[1] });
    expect(m.trueness).toMatchObject({ assigned: 5, uncertainty: 0.02, source: 'EQA material, peer mean' });
    expect(m.trueness!.bias).toBeCloseTo(0.0308, 12);
    expect(m.notes).toEqual([]);
  });

  it('judges SD claims on the SD and CV claims on the CV, against UVLs for ℓ = the materials analysed', () => {
    const result = analyzePrecision(both(), options());
    const [l, h] = result.materials;
    const verdict = (s: number, claim: number, uvl: number) => (s <= claim ? 'verified' : s <= uvl ? 'consistent' : 'not-verified');
    expect(l.verdicts.repeatability).toBe(verdict(l.repeatability.sd, 0.03, l.uvl.repeatability));
    expect(h.verdicts.repeatability).toBe(verdict(h.repeatability.cv, 0.8, h.uvl.repeatability));
    expect(h.verdicts.withinLab).toBe(verdict(h.withinLab.cv, 1.2, h.uvl.withinLab));
    expect(h.uvl.repeatability).toBeCloseTo(upperVerificationLimit(0.8, 20, 0.05, 2), 14);
    // High: CV of repeatability 0.883% above its 0.8% claim but below the UVL 1.046%, so 'consistent'; its SD
    // (0.133) is below 0.8, so judging the SD against the CV claim would wrongly say 'verified'.
    expect(h.repeatability.cv).toBeCloseTo((100 * Math.sqrt(0.0178)) / 15.104, 12);
    expect(h.repeatability.sd).toBeLessThan(0.8);
    expect(h.verdicts.repeatability).toBe('consistent');
    expect(h.verdicts.withinLab).toBe('verified');
    expect(l.verdicts).toEqual({ repeatability: 'verified', withinLab: 'verified' });
  });

  it('refuses a row whose material the settings do not list, naming the material and its first row', () => {
    const rows = both();
    rows[6] = { ...rows[6], material: 'Mid' };
    rows[9] = { ...rows[9], material: 'Mid' };
    const e = thrown(() => analyzePrecision(rows, options()));
    expect(e).toBeInstanceOf(OptionError);
    expect((e as OptionError).option).toBe('materials');
    expect(e.message).toContain('"Mid"');
    expect(e.message).toContain('row 7');
  });

  it('names the row by its 1-based index when it has no position', () => {
    const rows = both().map(({ position: _p, ...r }) => r);
    rows[3] = { ...rows[3], value: Number.NaN };
    expect(() => analyzePrecision(rows, options())).toThrow('row 4');
    rows[3] = { ...rows[3], value: 5, day: '  ' };
    expect(() => analyzePrecision(rows, options())).toThrow('row 4: the day (or run) is empty');
  });

  it('never uses excluded rows, and counts them', () => {
    const rows = both();
    rows[2] = { ...rows[2], value: 9.99, excluded: true, exclusionReason: 'clot' };
    const result = analyzePrecision(rows, options());
    const m = result.materials[0];
    expect(result.excludedCount).toBe(1);
    expect(m.n).toBe(24);
    expect(m.byDay[0].values).toEqual([5.02, 5.05, 5.01, 5.04]);
    const without = LOW.map((d, i) => (i === 0 ? d.filter((_, j) => j !== 2) : d));
    expect(m.repeatability.sd).toBe(Math.sqrt(oneWayAnova(without).msWithin));
  });

  it('notes an unbalanced design with n0, and fewer results than planned', () => {
    const rows = both().filter((r) => !(r.material === 'Low' && r.position === 13)); // day 3, replicate 3
    const m = analyzePrecision(rows, options()).materials[0];
    expect(m.anova.balanced).toBe(false);
    expect(m.anova.n0).toBeCloseTo((24 - 116 / 24) / 4, 14);
    expect(m.notes).toEqual([
      'Unbalanced: day 2026-03-04 has 4 results, the others 5; the between-day component uses the effective results per day n0 = 4.792 in place of a common count.',
      '24 results of the 25 planned (5 days × 5 replicates).',
    ]);
  });

  it('notes a missing planned day and fewer than 5 days; warns below 3 days and below 10 df for repeatability', () => {
    const four = analyzePrecision(rowsOf('Low', LOW.slice(0, 4)), { materials: [low] });
    expect(four.materials[0].notes).toContain('Results on 4 days, of the 5 planned, fewer than the 5 days of the EP15-A3 design (practice), so the between-day and within-laboratory estimates are less certain.');
    expect(four.warnings).toEqual([]);
    const two = analyzePrecision(rowsOf('Low', LOW.slice(0, 2)), { materials: [low] });
    expect(two.materials[0].days).toBe(2);
    expect(two.warnings.some((w) => w.startsWith('Material "Low": results on only 2 days;') && w.includes('no verdict is meaningful'))).toBe(true);
    expect(two.warnings.some((w) => w.includes('repeatability has 8 degrees of freedom'))).toBe(true);
  });

  it('refuses a material with results on one day only, or one result per day, naming it', () => {
    const oneDay = thrown(() => analyzePrecision(rowsOf('Low', LOW.slice(0, 1)), { materials: [low] }));
    expect(oneDay).toBeInstanceOf(OptionError);
    expect(oneDay.message).toContain('"Low" has results on 1 day only');
    const single = thrown(() => analyzePrecision(rowsOf('Low', LOW.map((d) => d.slice(0, 1))), { materials: [low] }));
    expect(single).toBeInstanceOf(OptionError);
    expect(single.message).toContain('"Low" has one result on each day');
  });

  it('leaves out a material with no included results, with a warning, and counts ℓ over the materials analysed', () => {
    const result = analyzePrecision(rowsOf('Low', LOW), options());
    expect(result.materials.map((m) => m.name)).toEqual(['Low']);
    expect(result.materialsTested).toBe(1);
    expect(result.warnings).toContain('Material "High" has no results, so it is not analysed.');
    expect(result.materials[0].uvl.repeatability).toBeCloseTo(upperVerificationLimit(0.03, 20, 0.05, 1), 14);
    const excluded = analyzePrecision(both().map((r) => (r.material === 'High' ? { ...r, excluded: true } : r)), options());
    expect(excluded.warnings).toContain('Material "High": all 25 results are excluded, so it is not analysed.');
    expect(excluded.excludedCount).toBe(25);
    expect(() => analyzePrecision([], options())).toThrow(OptionError);
  });

  it('sorts days naturally: numbers by value, dates and labels with digit runs by value', () => {
    const grid = [[1, 2], [3, 4], [5, 6]];
    const byLabels = (labels: string[]) => analyzePrecision(rowsOf('Low', grid, 1, labels), { materials: [low] }).materials[0].byDay.map((d) => d.day);
    expect(byLabels(['10', '2', '1'])).toEqual(['1', '2', '10']);
    expect(byLabels(['run 10', 'run 2', 'run 1'])).toEqual(['run 1', 'run 2', 'run 10']);
    expect(byLabels(['2026-03-10', '2026-03-09', '2025-12-31'])).toEqual(['2025-12-31', '2026-03-09', '2026-03-10']);
  });

  it('flags a far replicate by its grid row, with a warning, and keeps it in the figures', () => {
    const rows = both();
    rows[7] = { ...rows[7], value: 5.6 }; // day 2, replicate 3, grid row 8
    const result = analyzePrecision(rows, options());
    const m = result.materials[0];
    expect(m.n).toBe(25);
    expect(m.outliers).toHaveLength(1);
    expect(m.outliers[0]).toMatchObject({ position: 8, day: '2026-03-03', replicate: 3, value: 5.6 });
    expect(m.outliers[0].why).toContain('more than 5.5 × s_r');
    expect(result.warnings.some((w) => w.includes('Material "Low": 1 replicate lies more than 5.5 × s_r from the other results of its day (row 8)'))).toBe(true);
    expect(analyzePrecision(rows, options({ outlierFactor: 50 })).materials[0].outliers).toEqual([]);
  });

  it('refuses α outside (0, 0.5), a duplicate material, a bad claim and a CV claim at mean 0', () => {
    expect(() => analyzePrecision(both(), options({ alpha: 0.5 }))).toThrow(new OptionError('alpha', 'must be between 0 and 0.5 (exclusive)'));
    expect(() => analyzePrecision(both(), options({ alpha: 0 }))).toThrow(OptionError);
    expect(() => analyzePrecision(both(), { materials: [low, { ...low }] })).toThrow('names "Low" twice');
    expect(() => analyzePrecision(both(), { materials: [{ ...low, claimRepeatability: 0 }, high] })).toThrow('"Low": claimRepeatability must be a positive number');
    expect(() => analyzePrecision(both(), { materials: [] })).toThrow(OptionError);
    const centred = rowsOf('Zero', [[-1, 1], [-2, 2], [0.5, -0.5]]);
    expect(() => analyzePrecision(centred, { materials: [{ ...high, name: 'Zero' }] })).toThrow('"Zero": its claims are CVs');
  });

  it('warns when the within-laboratory claim is below the repeatability claim', () => {
    const result = analyzePrecision(rowsOf('Low', LOW), { materials: [{ ...low, claimWithinLab: 0.02 }] });
    expect(result.warnings.some((w) => w.includes('within-laboratory claim (0.02) is smaller than the repeatability claim (0.03)'))).toBe(true);
  });

  it('leaves its input unchanged and gives the same result twice', () => {
    const rows = both();
    const copy = JSON.parse(JSON.stringify(rows));
    const first = analyzePrecision(rows, options());
    expect(rows).toEqual(copy);
    expect(analyzePrecision(rows, options())).toEqual(first);
  });
});
