import { dayPlot, dayPlotOptions, dayPlotSummary, dayTick, flaggedIndices, spreadOffset } from './precision-chart';
import { LEVEL_1, LEVEL_2 } from '@shared/kinds/precision/words-fixture';
import { precisionFormat } from './precision-result';

const F = precisionFormat({ settings: { decimals: 2, unit: 'mmol/L' }, analyteUnit: 'mmol/L' } as never);

interface Scales {
  x: { min: number; max: number; afterBuildTicks: (s: { ticks: { value: number }[] }) => void; ticks: { callback: (v: number) => string } };
  y: { min: number; max: number };
}
interface Plugins {
  tooltip: { filter: (i: { raw: unknown }) => boolean; callbacks: { title: (i: { raw: unknown }[]) => string; label: (i: { raw: unknown }) => string[] } };
  parallaxMarkers: unknown;
}

describe('precision day plot', () => {
  it('spreads a day’s results across its column, one result at the centre', () => {
    expect(spreadOffset(0, 1)).toBe(0);
    expect([0, 1, 2].map((j) => spreadOffset(j, 3))).toEqual([-0.18, 0, 0.18]);
  });

  it('draws each day as a column of its results with its mean as a short bar, in the engine’s day order', () => {
    const plot = dayPlot(LEVEL_1, F);
    expect(plot.days).toEqual(['2026-03-02', '2026-03-03', '2026-03-04']);
    expect(plot.datasets.map((d) => d.label)).toEqual(['Results', "Day's mean"]);
    const [results, means] = plot.datasets;
    expect(results.data.map((p) => [Number(p.x.toFixed(2)), p.y])).toEqual([
      [0.82, 5.41], [1, 5.45], [1.18, 5.43], [1.82, 5.5], [2, 5.52], [2.18, 5.48], [2.82, 5.38], [3, 5.4], [3.18, 5.42],
    ]);
    expect(results.data[3].tip).toEqual(['Day 2026-03-03', 'Result 5.50 mmol/L', 'Day mean 5.500 mmol/L']);
    expect(means.pointStyle).toBe('line');
    expect(means.data.map((p) => [p.x, p.y])).toEqual([[1, 5.43], [2, 5.5], [3, 5.4]]);
    expect(means.data[0].tip).toEqual(['Day 2026-03-02', 'Day mean 5.430 mmol/L (3 results)', 'Grand mean 5.443 mmol/L']);
  });

  it('draws the grand mean as a line named with its value, and axes that reach every point', () => {
    const plot = dayPlot(LEVEL_1, F);
    expect(plot.markers.lines).toEqual([expect.objectContaining({ axis: 'y', value: LEVEL_1.mean, label: 'Grand mean 5.443 mmol/L' })]);
    expect(plot.x).toMatchObject({ min: 0.5, max: 3.5, ticks: [1, 2, 3] });
    expect(plot.y.min).toBeLessThan(5.38);
    expect(plot.y.max).toBeGreaterThan(5.52);
  });

  it('draws flagged replicates apart as diamonds, with why in their tooltip', () => {
    const plot = dayPlot(LEVEL_2, F);
    expect(plot.datasets.map((d) => d.label)).toEqual(['Results', 'Flagged replicates', "Day's mean"]);
    const flagged = plot.datasets[1];
    expect(flagged.pointStyle).toBe('rectRot');
    expect(flagged.data).toEqual([{ x: 2 - 0.18, y: 12.2, tip: ['Day 2', 'Result 12.20 mmol/L', 'Day mean 12.000 mmol/L', 'Flagged: More than 5.5 repeatability SDs from the day mean'] }]);
    expect(plot.datasets[0].data).toHaveLength(8);
  });

  it('flags one result per flagged replicate, even when a day has the value twice', () => {
    const twice = { ...LEVEL_2, outliers: [{ day: '2', replicate: 2, value: 11.9, why: 'x' }, { day: '9', replicate: 1, value: 1, why: 'no such day' }] };
    expect(flaggedIndices(twice)).toEqual(new Map([['2', new Map([[1, 'x']])]]));
    expect(dayPlot(twice, F).datasets[1].data).toHaveLength(1);
  });

  it('says the plot in words: counts, grand mean, range of day means, the day furthest away, flags', () => {
    expect(dayPlotSummary(LEVEL_1, F)).toBe(
      'Level 1: 9 results on 3 days around the grand mean 5.443 mmol/L. Day means run from 5.400 mmol/L (day 2026-03-04) to 5.500 mmol/L (day 2026-03-03); ' +
        'the day furthest from the grand mean is 2026-03-03, 0.057 mmol/L above it.',
    );
    expect(dayPlotSummary(LEVEL_2, F)).toMatch(/the day furthest from the grand mean is 3, 0\.200 mmol\/L below it\. 1 flagged replicate, drawn as diamonds\.$/);
    expect(dayPlotSummary({ ...LEVEL_1, byDay: [] }, F)).toBe('Level 1: no results to draw.');
    expect(dayPlotSummary({ ...LEVEL_1, n: 3, byDay: [LEVEL_1.byDay[0]] }, F)).toMatch(/One day only: its mean is the grand mean\.$/);
  });

  it('names the days on the x axis at 1, 2, … and nothing between', () => {
    expect(dayTick(['a', 'b'], 1)).toBe('a');
    expect(dayTick(['a', 'b'], '2')).toBe('b');
    expect(dayTick(['a', 'b'], 1.5)).toBe('');
    expect(dayTick(['a', 'b'], 3)).toBe('');
  });

  it('gives chart.js a day axis with ticks at the days, the padded results axis and a tooltip from each point', () => {
    const plot = dayPlot(LEVEL_2, F);
    const options = dayPlotOptions(plot, 'Result (mmol/L)') as { scales: Scales; plugins: Plugins };
    const scale = { ticks: [{ value: 0.5 }, { value: 1.5 }] };
    options.scales.x.afterBuildTicks(scale);
    expect(scale.ticks).toEqual([{ value: 1 }, { value: 2 }, { value: 3 }]);
    expect(options.scales.x.ticks.callback(3)).toBe('3');
    expect([options.scales.x.min, options.scales.x.max]).toEqual([0.5, 3.5]);
    expect([options.scales.y.min, options.scales.y.max]).toEqual([plot.y.min, plot.y.max]);
    const raw = plot.datasets[1].data[0];
    expect(options.plugins.tooltip.filter({ raw })).toBe(true);
    expect(options.plugins.tooltip.filter({ raw: { x: 1, y: 1 } })).toBe(false);
    expect(options.plugins.tooltip.callbacks.title([{ raw }])).toBe('Day 2');
    expect(options.plugins.tooltip.callbacks.label({ raw })).toEqual(['Result 12.20 mmol/L', 'Day mean 12.000 mmol/L', 'Flagged: More than 5.5 repeatability SDs from the day mean']);
    expect(options.plugins.parallaxMarkers).toBe(plot.markers);
  });
});
