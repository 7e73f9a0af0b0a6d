import type { LimitResult } from '../../../../../../shared/stats/reference-interval';
import { PALETTE } from '../../findings/charts/palette';
import type { GridRow } from '../../specimens/specimen-layout';
import { analysedValues, binCount, stripData, valueHistogram } from './interval-charts';

const row = (uid: number, value: string, sex: string, excluded = false): GridRow => ({ uid, label: `R${uid}`, value, sex, ageBand: '', excluded, exclusionReason: '', note: '' });
const limit = (estimate: number, ci: [number, number], rankCi: [number, number] | null): LimitResult => ({
  percentile: 2.5, estimate, ci, rankCi, ranks: null, distribution: null,
});
const label = (v: number): string => v.toFixed(1);

describe('interval chart data', () => {
  it('reads the analysed values with their grid positions, skipping excluded, empty and other-subgroup rows', () => {
    const rows = [row(1, '4,2', 'F'), row(2, '5.0', 'M'), row(3, '', 'F'), row(4, '9.9', 'F', true), row(5, '3.8', 'F')];
    expect(analysedValues(rows)).toEqual([{ position: 1, value: 4.2 }, { position: 2, value: 5 }, { position: 5, value: 3.8 }]);
    expect(analysedValues(rows, { field: 'sex', group: 'F' })).toEqual([{ position: 1, value: 4.2 }, { position: 5, value: 3.8 }]);
  });

  it('chooses about √n bins, between 8 and 30', () => {
    expect(binCount(20)).toBe(8);
    expect(binCount(120)).toBe(11);
    expect(binCount(5000)).toBe(30);
  });

  it('counts every value once and draws each limit with its bootstrap band and rank-based CI lines', () => {
    const values = Array.from({ length: 120 }, (_, i) => 50 + i * 0.25);
    const h = valueHistogram(values, limit(51, [50.5, 51.6], [50.25, 51.75]), limit(79, [78.2, 79.6], null), label);
    expect(h.bars.reduce((s, b) => s + b.y, 0)).toBe(120);
    expect(h.markers.bands).toEqual([
      { axis: 'x', from: 50.5, to: 51.6, color: PALETTE.biasBand },
      { axis: 'x', from: 78.2, to: 79.6, color: PALETTE.biasBand },
    ]);
    expect(h.markers.lines.map((l) => [l.value, l.label ?? null])).toEqual([[51, 'Lower 51.0'], [50.25, null], [51.75, null], [79, 'Upper 79.0']]);
  });

  it('colours the bars wholly beyond a limit as tails', () => {
    const h = valueHistogram([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], limit(3.5, [3, 4], null), null, label);
    expect(h.colors.slice(0, 3)).toEqual([PALETTE.tail, PALETTE.tail, PALETTE.barInCi]);
    expect(h.colors[7]).toBe(PALETTE.barInCi);
  });

  it('draws a one-sided interval with one limit only', () => {
    const h = valueHistogram([1, 2, 3, 4, 5, 6, 7, 8], null, limit(7.5, [7, 8], null), label);
    expect(h.markers.lines).toHaveLength(1);
    expect(h.markers.lines[0].label).toBe('Upper 7.5');
  });

  it('puts the values outside the stated limits apart, each at its row', () => {
    const s = stripData([{ position: 1, value: 3.4 }, { position: 2, value: 4.1 }, { position: 3, value: 5.1 }, { position: 4, value: 5.2 }], { lower: 3.5, upper: 5.1 }, label);
    expect(s.inside).toEqual([{ x: 4.1, y: 2 }, { x: 5.1, y: 3 }]);
    expect(s.outside).toEqual([{ x: 3.4, y: 1 }, { x: 5.2, y: 4 }]);
    expect(s.markers.lines.map((l) => l.label)).toEqual(['Lower 3.5', 'Upper 5.1']);
  });
});
