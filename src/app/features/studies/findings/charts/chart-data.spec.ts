import type { ComparisonRegression, NullDistributionPlot } from '../comparison/engine-types';
import { differenceDatasets, differenceMarkers } from './difference-data';
import { biasHistogram, binBars, nullHistogram, tailShare } from './histogram-data';
import { labelPadding, markerRange } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';
import { extent, scatterDatasets } from './scatter-data';

const point = (x: number, y: number, excluded = false): PlotPoint => ({ position: 1, label: '', x, y, mean: (x + y) / 2, difference: y - x, excluded });
const points = [point(3, 3.2), point(10, 10.4), point(20, 19.5, true)];
const regression: ComparisonRegression = {
  method: 'passing-bablok', demingRatio: null, slope: { estimate: 1.02, ci: [1, 1.04] }, intercept: { estimate: 0.1, ci: [0, 0.2] },
  linearityP: 0.6, ciMethod: 'rank', correlation: 0.99,
};
const label = (v: number): string => v.toFixed(2);

describe('comparison scatter', () => {
  it('spans the identity line over the lowest and highest of x and y', () => {
    expect(extent(points)).toEqual([3, 20]);
    const identity = scatterDatasets(points, regression).find((d) => d.label === 'Identity y = x')!;
    expect(identity.data).toEqual([{ x: 3, y: 3 }, { x: 20, y: 20 }]);
  });

  it('draws the regression line y = a + b·x and keeps excluded pairs apart', () => {
    const sets = scatterDatasets(points, regression);
    expect(sets.map((d) => d.label)).toEqual(['Pairs', 'Excluded pairs', 'Identity y = x', 'Passing–Bablok: y = 0.100 + 1.020·x']);
    const line = sets[3].data;
    expect(line[0].y).toBeCloseTo(0.1 + 1.02 * 3);
    expect(line[1].y).toBeCloseTo(0.1 + 1.02 * 20);
    expect(sets[0].data).toHaveLength(2);
    expect(sets[1].data).toEqual([{ x: 20, y: 19.5 }]);
  });

  it('leaves the regression line out when the regression was not estimated', () => {
    const none = { ...regression, slope: { estimate: null, ci: null } };
    expect(scatterDatasets(points, none).map((d) => d.label)).not.toContain(expect.stringMatching(/Passing/));
    expect(scatterDatasets([], regression).map((d) => d.label)).toEqual(['Pairs']);
  });
});

describe('difference plot', () => {
  it('plots each difference against its pair mean', () => {
    expect(differenceDatasets(points)[0].data).toEqual([{ x: 3.1, y: expect.closeTo(0.2) }, { x: 10.2, y: expect.closeTo(0.4) }]);
  });

  it('draws zero, the bias and both limits of agreement with their CI bands', () => {
    const core = {
      bias: { mean: { estimate: 0.3, ci: [0.2, 0.4] as [number, number], pValue: 0.01, se: 0.05 }, median: { estimate: 0.25, ci: null, pValue: null, se: null } },
      limitsOfAgreement: { multiplier: 1.96, lower: { estimate: -0.1, ci: [-0.2, 0] as [number, number] }, upper: { estimate: 0.7, ci: null } },
    };
    const m = differenceMarkers(core, label);
    expect(m.lines.map((l) => [l.value, l.label])).toEqual([[0, undefined], [0.3, 'Mean bias 0.30'], [0.7, 'Upper limit 0.70'], [-0.1, 'Lower limit -0.10']]);
    expect(m.bands.map((b) => [b.from, b.to])).toEqual([[0.2, 0.4], [-0.2, 0]]);
    expect(markerRange(m, 'y')).toEqual([-0.2, 0.7]);
    expect(markerRange(m, 'x')).toBeNull();
    expect(labelPadding(m)).toEqual({ right: 150, top: 0 });
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

  it('puts each bin at its middle with its count', () => {
    expect(binBars(plot.bins)).toEqual([{ x: -0.2, y: 2 }, { x: 0, y: 90 }, { x: 0.2, y: 8 }]);
  });

  it('shades both tails of the null distribution and marks the observed value and its mirror', () => {
    const h = nullHistogram(plot, label);
    expect(h.colors).toEqual([PALETTE.tail, PALETTE.bar, PALETTE.tail]);
    expect(h.markers.lines.map((l) => l.value)).toEqual([0, 0.1, -0.1]);
    expect(h.markers.lines[1].label).toBe('Observed 0.10');
    expect(h.markers.bands.map((b) => [b.from, b.to])).toEqual([[-Infinity, -0.1], [0.1, Infinity]]);
    expect(markerRange(h.markers, 'x')).toEqual([-0.1, 0.1]);
    expect(tailShare(plot)).toBeCloseTo(0.1);
  });

  it('colours the bias distribution inside its CI and marks the estimate and the limits', () => {
    const bins = [{ from: 0, to: 0.1, count: 3 }, { from: 0.1, to: 0.2, count: 50 }, { from: 0.2, to: 0.3, count: 4 }, { from: 0.3, to: 0.4, count: 1 }];
    const h = biasHistogram(bins, 0.15, [0.1, 0.2], label);
    // A bin whose left edge is the upper limit holds replicates equal to it: inside the CI.
    expect(h.colors).toEqual([PALETTE.bar, PALETTE.barInCi, PALETTE.barInCi, PALETTE.bar]);
    expect(h.markers.lines.map((l) => l.value)).toEqual([0.1, 0.2, 0.15]);
    expect(biasHistogram(bins, null, null, label).markers.lines).toEqual([]);
  });
});
