import { COMPARISON_LAYOUT, GridRow, blankRow } from '../../specimens/specimen-layout';
import { difference, plotPoints } from './plot-points';

const row = (values: Partial<Record<string, string | boolean>>): GridRow => ({ ...blankRow(COMPARISON_LAYOUT), ...values });

describe('plot points', () => {
  it('computes the plotted difference of each kind', () => {
    expect(difference(4, 5, 'absolute')).toBe(1);
    expect(difference(4, 5, 'percent-x')).toBe(25);
    expect(difference(4, 6, 'percent-mean')).toBe(40);
    expect(difference(0, 0, 'percent-x')).toBeNaN();
  });

  it('plots the pairs with both results, keeps grid positions, and marks excluded ones', () => {
    const rows = [
      row({ label: 'A', comparative: '4.0', candidate: '4,4' }),
      row({ label: 'B', comparative: '5.0', candidate: '' }),
      row({ label: 'C', comparative: '6.0', candidate: '6.3', excluded: true, exclusionReason: 'clotted' }),
    ];
    const points = plotPoints(rows, 'absolute');
    expect(points.map((p) => [p.position, p.label, p.excluded])).toEqual([[1, 'A', false], [3, 'C', true]]);
    expect(points[0].mean).toBeCloseTo(4.2);
    expect(points[0].difference).toBeCloseTo(0.4);
  });
});
