import type { PlotPoint } from '../../charts/plot-points';
import type { GridRow } from '../../../specimens/specimen-layout';
import type { ComparisonFindingsResult } from '../comparison-result';
import { pairFlags, pairFormat, pairName, pairRows, pairTip } from './pair-rows';

const point = (position: number, x: number, y: number, excluded = false, label = `S${position}`): PlotPoint => ({
  position, label, x, y, mean: (x + y) / 2, difference: y - x, excluded,
});
const result = (over: Partial<ComparisonFindingsResult> = {}): ComparisonFindingsResult => ({
  differenceType: 'absolute',
  outliers: [],
  outlierPositions: [3],
  bias: { mean: { estimate: 0.2, ci: null, pValue: null, se: null }, median: { estimate: 0.2, ci: null, pValue: null, se: null } },
  sd: { estimate: 0.1, ci: null },
  limitsOfAgreement: { multiplier: 1.96, lower: { estimate: 0.004, ci: null }, upper: { estimate: 0.396, ci: null } },
  ...over,
}) as unknown as ComparisonFindingsResult;
const rows = [{ uid: 1 }, { uid: 2 }, { uid: 3 }, { uid: 4, exclusionReason: ' clotted ' }] as GridRow[];
const points = [point(1, 4, 4.2), point(2, 10, 9.9), point(3, 8, 8.9), point(4, 6, 5, true)];

describe('the pairs behind the bias', () => {
  it('gives each pair its difference, % difference of the pair mean and standardized difference', () => {
    const [a, b] = pairRows(points, rows, result());
    expect(a.position).toBe(1);
    expect(a.difference).toBeCloseTo(0.2);
    expect(a.percent).toBeCloseTo((100 * 0.2) / 4.1);
    expect(a.standardized).toBeCloseTo(0);
    expect(b.standardized).toBeCloseTo(-3);
  });

  it('flags the outliers by their grid position, excluded rows with their reason, and pairs beyond the limits', () => {
    const table = pairRows(points, rows, result());
    expect(table.map(pairFlags)).toEqual([
      [], ['Beyond the limits of agreement'], ['Possible outlier', 'Beyond the limits of agreement'], ['Excluded: clotted'],
    ]);
    // Results stored before the server added grid positions name outliers by their analysed row.
    expect(pairRows(points, rows, result({ outlierPositions: undefined, outliers: [2] })).map((r) => r.outlier)).toEqual([false, true, false, false]);
  });

  it('measures % and standardized differences in the analysis’s own difference type', () => {
    const percentX = [point(1, 4, 4.4)].map((p) => ({ ...p, difference: 10 }));
    const [r] = pairRows(percentX, rows, result({ differenceType: 'percent-x', bias: { mean: { estimate: 5, ci: null, pValue: null, se: null } } as never, sd: { estimate: 2.5, ci: null } }));
    expect(r.percent).toBeCloseTo(10);
    expect(r.standardized).toBeCloseTo(2);
    expect(pairRows(points, rows, result({ sd: { estimate: null, ci: null } }))[0].standardized).toBeNull();
  });

  it('writes a tooltip naming the specimen, both results and the difference, in the table’s decimals', () => {
    const f = pairFormat({ decimals: 1 }, 'mmol/L', 'absolute');
    expect(pairTip(point(7, 5.2, 5.4, false, 'VH-007'), f)).toEqual([
      'VH-007 (row 7)', 'Comparative 5.2 mmol/L', 'Candidate 5.4 mmol/L', 'Difference 0.2 mmol/L (3.8 %)',
    ]);
    expect(pairTip(point(8, 6, 5.5, false, ''), f, ['Possible outlier'])).toEqual([
      'Row 8', 'Comparative 6.0 mmol/L', 'Candidate 5.5 mmol/L', 'Difference −0.5 mmol/L (−8.7 %)', 'Possible outlier',
    ]);
    expect(pairName({ label: ' A1 ', position: 2 })).toBe('A1 (row 2)');
    expect(pairFormat({ decimals: 0 }, '', 'percent-x').percentOf).toBe('comparative x');
  });
});
