import type { ComparisonRegression, NullDistributionPlot } from '../comparison/engine-types';
import { allowableArea, decisionLevelMarks, differenceAxes, differenceDatasets, differenceMarkers } from './difference-data';
import { keyOf, legendEntries, linearScale, tipOf } from './chart-options';
import { biasHistogram, binBars, histogramAxes, nullHistogram, rangeWords, tailShare } from './histogram-data';
import { markerRange } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';
import { extent, scatterAxis, scatterBand, scatterDatasets } from './scatter-data';

const point = (x: number, y: number, excluded = false, position = 1): PlotPoint => ({ position, label: `S${position}`, x, y, mean: (x + y) / 2, difference: y - x, excluded });
const points = [point(3, 3.2, false, 1), point(10, 10.4, false, 2), point(20, 19.5, true, 3)];
const regression: ComparisonRegression = {
  method: 'passing-bablok', demingRatio: null, slope: { estimate: 1.02, ci: [1, 1.04] }, intercept: { estimate: 0.1, ci: [0, 0.2] },
  linearityP: 0.6, ciMethod: 'rank', correlation: 0.99,
};
const label = (v: number): string => v.toFixed(2);
const core = {
  bias: { mean: { estimate: 0.3, ci: [0.2, 0.4] as [number, number], pValue: 0.01, se: 0.05 }, median: { estimate: 0.25, ci: null, pValue: null, se: null } },
  limitsOfAgreement: { multiplier: 1.96, lower: { estimate: -0.1, ci: [-0.2, 0] as [number, number] }, upper: { estimate: 0.7, ci: null } },
};

describe('comparison scatter', () => {
  it('spans the identity line and the regression line across the padded axis, so no point sits on its edge', () => {
    expect(extent(points)).toEqual([3, 20]);
    const axis = scatterAxis(points);
    expect(axis.min).toBeLessThan(3);
    expect(axis.max).toBeGreaterThan(20);
    const sets = scatterDatasets(points, regression, { axis });
    const identity = sets.find((d) => d.label === 'Identity y = x')!;
    expect(identity.data).toEqual([{ x: axis.min, y: axis.min }, { x: axis.max, y: axis.max }]);
    const line = sets.find((d) => String(d.label).startsWith('Passing'))!.data;
    expect(line[0].y).toBeCloseTo(0.1 + 1.02 * axis.min);
    expect(line[1].y).toBeCloseTo(0.1 + 1.02 * axis.max);
  });

  it('keys each point by its grid position, gives it its tooltip, and keeps excluded pairs apart as crosses', () => {
    const tip = (p: PlotPoint): string[] => [p.label, `x ${p.x}`];
    const sets = scatterDatasets(points, regression, { tip });
    expect(sets.map((d) => d.label)).toEqual(['Pairs', 'Excluded pairs', 'Identity y = x', 'Passing–Bablok: y = 0.100 + 1.020·x']);
    expect(sets[0].data).toEqual([{ x: 3, y: 3.2, key: 1, tip: ['S1', 'x 3'] }, { x: 10, y: 10.4, key: 2, tip: ['S2', 'x 10'] }]);
    expect(sets[1].data).toEqual([{ x: 20, y: 19.5, key: 3, tip: ['S3', 'x 20'] }]);
    expect(sets[1].pointStyle).toBe('crossRot');
  });

  it('rings the selected specimen over the other points, and rings nothing when none is selected', () => {
    const sets = scatterDatasets(points, regression, { selected: 2 });
    const ring = sets.find((d) => d.highlight)!;
    expect(ring.label).toBe('Selected specimen');
    expect(ring.data).toEqual([{ x: 10, y: 10.4, key: 2 }]);
    expect(ring.order).toBe(-1);
    expect(scatterDatasets(points, regression, { selected: null }).some((d) => d.highlight)).toBe(false);
    expect(scatterDatasets(points, regression, { selected: 99 }).some((d) => d.highlight)).toBe(false);
  });

  it('leaves the regression line out when the regression was not estimated', () => {
    const none = { ...regression, slope: { estimate: null, ci: null } };
    expect(scatterDatasets(points, none).map((d) => d.label)).not.toContain(expect.stringMatching(/Passing/));
    expect(scatterDatasets([], regression).map((d) => d.label)).toEqual(['Pairs']);
  });

  it('shades the regression line’s CI band from the engine, named with its level, and none without one', () => {
    const band = [{ x: 3, fit: 3.16, ci: [2.9, 3.4] as [number, number] }, { x: 20, fit: 20.5, ci: [20.1, 20.9] as [number, number] }];
    const area = scatterBand({ ...regression, band }, 0.9)!;
    expect(area.points).toEqual([{ x: 3, lower: 2.9, upper: 3.4 }, { x: 20, lower: 20.1, upper: 20.9 }]);
    expect(area.label).toBe('90% CI of the regression line');
    expect(area.edge).toBe(PALETTE.regression);
    expect(legendEntries([], { areas: [area] }, false)).toEqual([{ text: '90% CI of the regression line', kind: 'area', color: PALETTE.regression, fill: PALETTE.regressionBand, dash: [2, 3] }]);
    expect(scatterBand(regression, 0.95)).toBeNull(); // a result of an engine before 1.4.0
    expect(scatterBand({ ...regression, band: [band[0], { ...band[1], ci: null }] }, 0.95)).toBeNull();
    expect(scatterBand(null, 0.95)).toBeNull();
  });
});

describe('difference plot', () => {
  it('plots each difference against its pair mean, or against x for a percentage of x', () => {
    expect(differenceDatasets(points)[0].data.map(({ x, y }) => [x, y])).toEqual([[3.1, expect.closeTo(0.2)], [10.2, expect.closeTo(0.4)]]);
    expect(differenceDatasets(points, { type: 'percent-x' })[0].data.map((d) => d.x)).toEqual([3, 10]);
  });

  it('draws zero, the bias and both limits of agreement with their CI bands, each named in the legend with its value', () => {
    const m = differenceMarkers(core, label, '95%');
    expect(m.lines.map((l) => [l.value, l.label])).toEqual([
      [0, undefined], [0.3, 'Mean bias 0.30'], [0.7, 'Upper limit of agreement 0.70'], [-0.1, 'Lower limit of agreement -0.10'],
    ]);
    expect(m.bands.map((b) => [b.from, b.to, b.label])).toEqual([[0.2, 0.4, '95% CI of the mean bias'], [-0.2, 0, '95% CI of each limit']]);
    expect(markerRange(m, 'y')).toEqual([-0.2, 0.7]);
    expect(markerRange(m, 'x')).toBeNull();
    // In the legend under the plot (no margin beside it): the pairs, the bands, then the lines with their values, dashes as drawn.
    expect(legendEntries(differenceDatasets(points), m, false).map((i) => [i.text, i.kind, i.dash ?? null])).toEqual([
      ['Pairs', 'point', null], ['Excluded pairs', 'cross', null],
      ['95% CI of the mean bias', 'rect', null], ['95% CI of each limit', 'rect', null],
      ['Mean bias 0.30', 'line', []], ['Upper limit of agreement 0.70', 'line', [6, 4]], ['Lower limit of agreement -0.10', 'line', [6, 4]],
    ]);
  });

  it('marks each decision level on the x axis and names them once', () => {
    const marks = decisionLevelMarks([5, 7, 11.1], (v) => v.toFixed(1));
    expect(marks.map((l) => [l.axis, l.value, l.axisMark])).toEqual([['x', 5, true], ['x', 7, true], ['x', 11.1, true]]);
    expect(marks.map((l) => l.label)).toEqual(['Decision levels 5.0, 7.0, 11.1', undefined, undefined]);
    expect(legendEntries([], { lines: marks }, false).map((i) => [i.text, i.kind])).toEqual([['Decision levels 5.0, 7.0, 11.1', 'triangle']]);
    expect(decisionLevelMarks([7], String)[0].label).toBe('Decision level 7');
  });

  it('shades the allowable bias as stated: a flat band for an absolute goal, a widening one for a percentage', () => {
    const axis = { min: 0, max: 20, step: 5, ticks: [0, 5, 10, 15, 20], decimals: 0 };
    const flat = allowableArea(axis, { absolute: 0.5, percent: null }, 'absolute', (v) => `${v.toFixed(2)} mmol/L`)!;
    expect(flat.points).toEqual([{ x: 0, lower: -0.5, upper: 0.5 }, { x: 20, lower: -0.5, upper: 0.5 }]);
    expect(flat.label).toBe('Allowable bias ±0.50 mmol/L');
    const widening = allowableArea(axis, { absolute: null, percent: 5 }, 'absolute', String)!;
    expect(widening.points[0]).toEqual({ x: 0, lower: -0, upper: 0 });
    expect(widening.points[widening.points.length - 1]).toEqual({ x: 20, lower: -1, upper: 1 });
    expect(allowableArea(axis, { absolute: null, percent: null }, 'absolute', String)).toBeNull();
    expect(legendEntries([], { areas: [flat] }, false).map((i) => [i.text, i.kind, i.dash])).toEqual([['Allowable bias ±0.50 mmol/L', 'area', [1, 2.5]]]);
  });

  it('pads both axes past every point, line and decision level, and reaches the band unless it is far wider', () => {
    const m = differenceMarkers(core, label);
    const axes = differenceAxes(points, m, 'absolute', [25], { absolute: 0.5, percent: null });
    expect(axes.x.min).toBeLessThan(3.1);
    expect(axes.x.max).toBeGreaterThan(25);
    expect(axes.y.min).toBeLessThan(-0.5);
    expect(axes.y.max).toBeGreaterThan(0.7);
    const wide = differenceAxes(points, m, 'absolute', [], { absolute: 50, percent: null });
    expect(wide.y.max).toBeLessThan(5);
  });
});

describe('bootstrap histograms', () => {
  const plot: NullDistributionPlot = {
    bins: [
      { from: -0.3, to: -0.1, count: 2, tail: 'lower' },
      { from: -0.1, to: 0.1, count: 90, tail: null },
      { from: 0.1, to: 0.3, count: 8, tail: 'upper' },
    ],
    lowerCutoff: -0.1, upperCutoff: 0.1, observed: 0.1, nullValue: 0,
  };

  it('puts each bin at its middle with its count, and its range and count in its tooltip', () => {
    expect(binBars(plot.bins)).toEqual([{ x: -0.2, y: 2 }, { x: 0, y: 90 }, { x: 0.2, y: 8 }]);
    const words = { range: (a: number, b: number) => `${a} to ${b}`, count: (n: number) => `${n} resamples` };
    expect(binBars(plot.bins, words)[1].tip).toEqual(['-0.1 to 0.1', '90 resamples']);
  });

  it('shades both tails of the null distribution light and marks the observed value and its mirror', () => {
    const h = nullHistogram(plot, label);
    expect(h.colors).toEqual([PALETTE.tail, PALETTE.barInCi, PALETTE.tail]);
    expect(h.markers.lines.map((l) => l.value)).toEqual([0, 0.1, -0.1]);
    expect(h.markers.lines[1].label).toBe('Observed 0.10');
    expect(h.markers.bands.map((b) => [b.from, b.to])).toEqual([[-Infinity, -0.1], [0.1, Infinity]]);
    expect(markerRange(h.markers, 'x')).toEqual([-0.1, 0.1]);
    expect(tailShare(plot)).toBeCloseTo(0.1);
  });

  it('pads the x axis past the outer bin edges and starts the counts at zero', () => {
    const h = nullHistogram(plot, label);
    const axes = histogramAxes(plot.bins, h.markers);
    expect(axes.x.min).toBeLessThan(-0.3);
    expect(axes.x.max).toBeGreaterThan(0.3);
    expect(axes.y.min).toBe(0);
    expect(axes.y.max).toBeGreaterThan(90);
  });

  it('colours the bias distribution inside its CI and marks the estimate and the limits', () => {
    const bins = [{ from: 0, to: 0.1, count: 3 }, { from: 0.1, to: 0.2, count: 50 }, { from: 0.2, to: 0.3, count: 4 }, { from: 0.3, to: 0.4, count: 1 }];
    const h = biasHistogram(bins, 0.15, [0.1, 0.2], label, undefined, '95%');
    // A bin whose left edge is the upper limit holds replicates equal to it: inside the CI.
    expect(h.colors).toEqual([PALETTE.bar, PALETTE.barInCi, PALETTE.barInCi, PALETTE.bar]);
    expect(h.markers.lines.map((l) => l.value)).toEqual([0.1, 0.2, 0.15]);
    expect(h.markers.lines[0].label).toBe('95% CI 0.10 to 0.20');
    expect(biasHistogram(bins, null, null, label).markers.lines).toEqual([]);
    const withUnit = (v: number): string => `${v.toFixed(2)} mmol/L`;
    expect(biasHistogram(bins, 0.15, [0.1, 0.2], withUnit).markers.lines[0].label).toBe('CI 0.10 to 0.20 mmol/L');
    expect(rangeWords('1', '2')).toBe('1 to 2');
  });
});

describe('the chart component’s pieces', () => {
  it('names the datasets in the legend by how they are drawn, the selected ring after them, and no histogram bars', () => {
    const sets = scatterDatasets(points, regression, { selected: 1 });
    expect(legendEntries(sets, { lines: [], bands: [] }, false).map((e) => [e.text, e.kind])).toEqual([
      ['Pairs', 'point'], ['Excluded pairs', 'cross'], ['Identity y = x', 'line'], ['Passing–Bablok: y = 0.100 + 1.020·x', 'line'], ['Selected specimen', 'ring'],
    ]);
    const h = nullHistogram({ bins: [], lowerCutoff: -1, upperCutoff: 1, observed: 1, nullValue: 0 }, label);
    expect(legendEntries([{ type: 'bar', label: 'Resamples' }], h.markers, true).map((e) => e.text)).toEqual(['Both tails (counted in p)', 'Observed 1.00', 'Mirror image -1.00']);
  });

  it('shows a tooltip only for what carries one (a pair, a bar), not for lines', () => {
    expect(tipOf({ x: 1, y: 2, tip: ['S1', 'Comparative 1.0'] })).toEqual(['S1', 'Comparative 1.0']);
    expect(tipOf({ x: 1, y: 2 })).toBeNull();
    expect(tipOf(null)).toBeNull();
  });

  it('finds the specimen under a click from the clicked element', () => {
    const chart = { data: { datasets: [{ data: [{ x: 0, y: 0 }] }, { data: [{ x: 1, y: 1, key: 7 }, { x: 2, y: 2, key: 9 }] }] } };
    expect(keyOf(chart as never, [{ datasetIndex: 1, index: 1 }])).toBe(9);
    expect(keyOf(chart as never, [{ datasetIndex: 0, index: 0 }])).toBeNull();
    expect(keyOf(chart as never, [])).toBeNull();
  });

  it('fixes a scale to the computed axis and writes its ticks with the axis decimals', () => {
    const scale = linearScale({ min: -0.5, max: 1, step: 0.5, ticks: [-0.5, 0, 0.5, 1], decimals: 1 }, 'Difference') as {
      min: number; max: number; ticks: { stepSize: number; callback: (v: number) => string };
    };
    expect([scale.min, scale.max, scale.ticks.stepSize]).toEqual([-0.5, 1, 0.5]);
    expect(scale.ticks.callback(-0.5)).toBe('−0.5');
    expect(scale.ticks.callback(1)).toBe('1.0');
    expect(linearScale(null, '')).toEqual({ type: 'linear', offset: false, title: { display: false, text: '' } });
  });
});
