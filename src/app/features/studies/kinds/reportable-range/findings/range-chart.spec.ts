import { rangeFormat } from '@shared/kinds/reportable-range/words';
import { polynomialAt } from '@shared/stats/polynomial-fit';
import { curveXs, goalAt, rangePlot } from './range-chart';
import { fractionRange, shortenedRange, straightRange } from './range-results.testing';

const F = rangeFormat('mmol/L', 1);
const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1e-9 * Math.max(1, Math.abs(b)));

describe('the drawing helpers of the linearity plot', () => {
  it('evaluates y = b0 + b1·x + … on the raw x', () => {
    expect(polynomialAt([1, 2, 3], 2)).toBe(1 + 4 + 12);
    expect(polynomialAt([5], 10)).toBe(5);
    expect(polynomialAt([0.5, -1, 0, 0.25], -2)).toBe(0.5 + 2 - 2);
  });

  it('takes the larger of the absolute goal and the % goal of the straight line’s value, as the engine does', () => {
    expect(goalAt(10, { absolute: 0.4, percent: 2 })).toBe(0.4);
    expect(goalAt(-30, { absolute: 0.4, percent: 2 })).toBeCloseTo(0.6, 12);
    expect(goalAt(30, { absolute: null, percent: 2 })).toBeCloseTo(0.6, 12);
    expect(goalAt(30, { absolute: 0.4, percent: null })).toBe(0.4);
    expect(goalAt(30, { absolute: null, percent: null })).toBeNull();
  });

  it('draws curves at even steps between the lowest and highest level, through every level’s x', () => {
    const xs = curveXs([2, 7, 32]);
    expect(xs[0]).toBe(2);
    expect(xs[xs.length - 1]).toBe(32);
    expect(xs).toContain(7);
    expect(xs.length).toBe(66);
    expect([...xs].sort((a, b) => a - b)).toEqual(xs);
    expect(curveXs([])).toEqual([]);
  });
});

describe('rangePlot', () => {
  it('draws every result and each level’s mean at the level’s assigned value, with tooltips in the study’s words', () => {
    const r = shortenedRange();
    const plot = rangePlot(r, F);
    expect(plot.datasets.map((d) => d.label)).toEqual(['Results', "Level's mean", 'Straight line', 'Best fit: polynomial of degree 3']);
    const [results, means] = plot.datasets;
    expect(results.data.map((p) => [p.x, p.y])).toEqual(r.levels.flatMap((l) => l.values.map((v) => [l.x, v])));
    expect(results.data[0].tip).toEqual(['Level 1', 'Result 2.0 mmol/L', 'Assigned 2.0 mmol/L']);
    expect(means.data.map((p) => [p.x, p.y])).toEqual(r.levels.map((l) => [l.x, l.mean]));
    expect(means.data[5].tip).toEqual([
      'Level 6', 'Mean 29.70 mmol/L (2 results)', 'Assigned 32.0 mmol/L', 'Straight line 30.76 mmol/L, best fit 29.77 mmol/L',
      'Deviation −0.98 mmol/L (−3.2%), allowable ±0.92 mmol/L',
    ]);
    expect(plot.xTitle).toBe('Assigned value (mmol/L)');
    expect(plot.yTitle).toBe('Result (mmol/L)');
  });

  it('draws the straight line dashed and the best fit as a smooth curve from the engine’s coefficients, over the levels only', () => {
    const r = shortenedRange();
    const plot = rangePlot(r, F);
    const straight = plot.datasets[2];
    const best = plot.datasets[3];
    expect(straight).toMatchObject({ showLine: true, borderDash: [6, 4], pointRadius: 0 });
    expect(best).toMatchObject({ showLine: true, pointRadius: 0 });
    expect(best.data.length).toBeGreaterThan(60);
    expect(best.data[0].x).toBe(2);
    expect(best.data[best.data.length - 1].x).toBe(32);
    // At each level the curves pass through the engine's straight-line and best-fit values.
    for (const l of r.levels) {
      close(straight.data.find((p) => p.x === l.x)!.y, l.linear);
      close(best.data.find((p) => p.x === l.x)!.y, l.fitted);
    }
  });

  it('shades the allowable band around the straight line, as wide at each level as the engine’s goal there', () => {
    const r = shortenedRange();
    const plot = rangePlot(r, F);
    const [band] = plot.markers.areas!;
    expect(band.label).toBe('Allowable nonlinearity around the straight line: 0.8 mmol/L or 3% of the level, whichever is larger');
    for (const l of r.levels) {
      const p = band.points.find((q) => q.x === l.x)!;
      close(p.upper, l.linear + l.goal);
      close(p.lower, l.linear - l.goal);
    }
    const withSource = rangePlot({ ...r, goal: { ...r.goal, source: 'Lab policy LP-7' } }, F);
    expect(withSource.markers.areas![0].label).toMatch(/whichever is larger \(source: Lab policy LP-7\)$/);
    expect(plot.caption).toBe(
      "12 results at 6 levels: each result a dot, each level's mean a short bar. The dashed line is the straight line, the solid curve the best fit (degree 3); " +
        'the shaded band around the straight line is the allowable nonlinearity.',
    );
  });

  it('has axes that reach every result, line and band edge', () => {
    const r = shortenedRange();
    const plot = rangePlot(r, F);
    const ys = [...r.levels.flatMap((l) => [...l.values, l.linear + l.goal, l.linear - l.goal])];
    expect(plot.y.min).toBeLessThan(Math.min(...ys));
    expect(plot.y.max).toBeGreaterThan(Math.max(...ys));
    // About eight ticks, so the levels fill the plot: 0 to 35 in fives, not −10 to 40 in tens.
    expect(plot.x).toMatchObject({ min: 0, max: 35, step: 5 });
  });

  it('draws one solid straight line when it fits best', () => {
    const plot = rangePlot(straightRange(), F);
    expect(plot.datasets.map((d) => d.label)).toEqual(['Results', "Level's mean", 'Straight line (the best fit)']);
    expect(plot.datasets[2].borderDash).toEqual([]);
    expect(plot.caption).toMatch(/The solid line is the straight line, which fits best; the shaded band/);
  });

  it('draws mixtures against the fraction of the high pool when no pool values are given', () => {
    const r = fractionRange();
    const plot = rangePlot(r, F);
    expect(plot.xTitle).toBe('Fraction of the high pool');
    expect(plot.datasets[0].data[0]).toMatchObject({ x: 0, y: 1.9, tip: ['Low pool', 'Result 1.9 mmol/L', 'Fraction 0.000'] });
    expect(plot.x.min).toBeLessThan(0);
    expect(plot.x.max).toBeGreaterThan(1);
  });

  it('draws no band without a goal, and says so', () => {
    const r = straightRange();
    const plot = rangePlot({ ...r, goal: { absolute: null, percent: null } }, F);
    expect(plot.markers.areas).toEqual([]);
    expect(plot.caption).toMatch(/no allowable nonlinearity is set, so no band is drawn\.$/);
  });
});
