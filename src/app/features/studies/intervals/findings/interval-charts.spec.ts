import type { LimitResult } from '@shared/stats/reference-interval';
import { valueBins } from '@shared/types/plot-axes';
import { PALETTE } from '../../findings/charts/palette';
import type { GridRow } from '../../specimens/specimen-layout';
import { type PlacedValue, analysedValues, individualName, stripData, valueHistogram } from './interval-charts';

const row = (uid: number, value: string, sex: string, excluded = false): GridRow => ({ uid, label: `R${uid}`, value, sex, ageBand: '', excluded, exclusionReason: '', note: '' });
const limit = (estimate: number, ci: [number, number], rankCi: [number, number] | null): LimitResult => ({
  percentile: 2.5, estimate, ci, rankCi, ranks: null, distribution: null,
});
const label = (v: number): string => v.toFixed(1);
const placed = (values: number[]): PlacedValue[] => values.map((value, i) => ({ position: i + 1, value, label: `RI-${i + 1}` }));

describe('interval chart data', () => {
  it('reads the analysed values with their grid positions and labels, skipping excluded, empty and other-subgroup rows', () => {
    const rows = [row(1, '4,2', 'F'), row(2, '5.0', 'M'), row(3, '', 'F'), row(4, '9.9', 'F', true), row(5, '3.8', 'F')];
    expect(analysedValues(rows)).toEqual([{ position: 1, value: 4.2, label: 'R1' }, { position: 2, value: 5, label: 'R2' }, { position: 5, value: 3.8, label: 'R5' }]);
    expect(analysedValues(rows, { field: 'sex', group: 'F' }).map((v) => v.position)).toEqual([1, 5]);
    expect(individualName({ label: 'R1', position: 1 })).toBe('R1 (row 1)');
    expect(individualName({ label: '', position: 4 })).toBe('Row 4');
  });

  it('counts every value once and draws each limit with its bootstrap band and rank-based CI lines, named in the legend', () => {
    const values = placed(Array.from({ length: 120 }, (_, i) => 50 + i * 0.25));
    const h = valueHistogram(values, limit(51, [50.5, 51.6], [50.25, 51.75]), limit(79, [78.2, 79.6], null), label, 0.01);
    expect(h.bars.reduce((s, b) => s + b.y, 0)).toBe(120);
    expect(h.markers.bands.map((b) => [b.from, b.to, b.label])).toEqual([
      [50.5, 51.6, 'Bootstrap CI 50.5 to 51.6'],
      [78.2, 79.6, 'Bootstrap CI 78.2 to 79.6'],
    ]);
    expect(h.markers.lines.map((l) => [l.value, l.label ?? null])).toEqual([
      [51, 'Lower limit 51.0'], [50.25, 'Rank-based CI 50.3 to 51.8'], [51.75, null], [79, 'Upper limit 79.0'],
    ]);
  });

  it('bins whole-number results at half-steps, so no bin is empty between two reported values', () => {
    // Every whole number from 60 to 79, six times each: a flat distribution must give flat bars.
    const values = placed(Array.from({ length: 120 }, (_, k) => 60 + (k % 20)));
    const h = valueHistogram(values, null, null, label, 1);
    expect(h.bars.map((b) => b.y)).toEqual(new Array(20).fill(6));
    expect(h.bars[0].x).toBe(60);
    // Padded: the outer bars are inside the axis, with ticks in whole numbers.
    expect(h.axes.x.min).toBeLessThan(59.5);
    expect(h.axes.x.max).toBeGreaterThan(79.5);
    expect(h.axes.x.ticks.every(Number.isInteger)).toBe(true);
  });

  it('names the range, the count and the individuals of a bar in its tooltip', () => {
    const values = placed([60, 61, 61, 62, 70, 71, 72, 73, 74, 75, 76, 77, 78, 79, 80, 81, 82, 83, 84, 85]);
    const h = valueHistogram(values, null, null, label, 1, { value: String, unit: 'µmol/L' });
    // 20 values over 26 whole numbers: bins of 5 (59.5 to 64.5 holds 60 to 64).
    expect(h.bars[0].tip).toEqual(['60 to 64 µmol/L', '4 individuals', 'RI-1 (row 1), RI-2 (row 2), RI-3 (row 3), RI-4 (row 4)']);
    const many = valueHistogram(placed(new Array(9).fill(5)), null, null, label, 1, { value: String, unit: '' });
    expect(many.bars[0].tip).toEqual(['5', '9 individuals', 'RI-1 (row 1), RI-2 (row 2), RI-3 (row 3), RI-4 (row 4), RI-5 (row 5), RI-6 (row 6) and 3 more']);
  });

  it('draws the bins of the shared rule the PDF uses (valueBins): whole numbers under a stated step of 0.1 binned, named and ticked in whole steps', () => {
    const values = placed([4, 5, 5, 7]);
    const h = valueHistogram(values, null, null, label, 0.1, { value: String, unit: '' });
    const shared = valueBins([4, 5, 5, 7], 0.1);
    expect(shared).toEqual({ step: 1, bins: [{ from: 3.5, to: 4.5, count: 1 }, { from: 4.5, to: 5.5, count: 2 }, { from: 5.5, to: 6.5, count: 0 }, { from: 6.5, to: 7.5, count: 1 }] });
    expect(h.bars.map((b) => [b.x, b.y])).toEqual(shared.bins.map((b) => [(b.from + b.to) / 2, b.count]));
    // Each bar names the one reportable value it holds (before, the stated 0.1 gave "4.05 to 4.95").
    expect(h.bars.map((b) => b.tip?.[0])).toEqual(['4', '5', '6', '7']);
    expect(h.axes.x.step).toBeGreaterThanOrEqual(1);
  });

  it('colours the bars wholly beyond a limit light', () => {
    const h = valueHistogram(placed([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]), limit(3.5, [3, 4], null), null, label, 1);
    // A bin for each value: those of 1, 2 and 3 lie below 3.5.
    expect(h.colors).toEqual([PALETTE.tail, PALETTE.tail, PALETTE.tail, ...new Array(7).fill(PALETTE.barInCi)]);
  });

  it('draws a one-sided interval with one limit only', () => {
    const h = valueHistogram(placed([1, 2, 3, 4, 5, 6, 7, 8]), null, limit(7.5, [7, 8], null), label, 1);
    expect(h.markers.lines).toHaveLength(1);
    expect(h.markers.lines[0].label).toBe('Upper limit 7.5');
  });

  it('puts the values outside the stated limits apart as diamonds, each at its row and named in its tooltip', () => {
    const s = stripData(placed([3.4, 4.1, 5.1, 5.2]), { lower: 3.5, upper: 5.1 }, label, 0.1);
    expect(s.inside.map(({ x, y }) => [x, y])).toEqual([[4.1, 2], [5.1, 3]]);
    expect(s.outside.map(({ x, y }) => [x, y])).toEqual([[3.4, 1], [5.2, 4]]);
    expect(s.outside[1].tip).toEqual(['RI-4 (row 4)', 'Value 5.2', 'Outside the stated interval']);
    expect(s.datasets.map((d) => [d.label, d.pointStyle])).toEqual([['Inside', 'circle'], ['Outside', 'rectRot']]);
    expect(s.markers.lines.map((l) => l.label)).toEqual(['Lower limit 3.5', 'Upper limit 5.1']);
    expect(s.axes.x.min).toBeLessThan(3.4);
    expect(s.axes.x.max).toBeGreaterThan(5.2);
  });
});
