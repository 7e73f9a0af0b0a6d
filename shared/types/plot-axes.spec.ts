import { binStep, binSteps, binTarget, clean, dataStep, niceAxis, paddedAxis, paddedDomain, resolutionBins, stepDecimals, valueBins } from './plot-axes';
import { histogram } from '../stats/histogram';

/** A seeded generator (an LCG) so the invented values are the same on every run. */
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return (state + 0.5) / 2 ** 32;
  };
}

/** 120 invented whole-number results around 70 (a creatinine-like spread), as an analyser reports them. */
function wholeNumbers(): number[] {
  const random = seeded(20261202);
  return Array.from({ length: 120 }, () => {
    const normal = Math.sqrt(-2 * Math.log(random())) * Math.cos(2 * Math.PI * random());
    return Math.round(Math.exp(Math.log(70) + 0.14 * normal));
  });
}

describe('nice ticks', () => {
  it('writes each step with the decimals it needs', () => {
    expect([0.5, 0.25, 10, 1e-3, 2, 0.1 + 0.2].map(stepDecimals)).toEqual([1, 2, 0, 3, 0, 1]);
    expect(clean(0.1 * 3)).toBe(0.3);
    expect(Object.is(clean(-0), 0)).toBe(true);
  });

  it('puts the ends on ticks of 1, 2 or 5 × 10^k that cover the range', () => {
    const a = niceAxis(0.07, 0.93);
    expect(a).toEqual({ min: 0, max: 1, step: 0.2, ticks: [0, 0.2, 0.4, 0.6, 0.8, 1], decimals: 1 });
    const b = niceAxis(-0.31, 0.74);
    expect(b.min).toBeLessThanOrEqual(-0.31);
    expect(b.max).toBeGreaterThanOrEqual(0.74);
    expect(b.ticks).toContain(0);
  });

  it('uses 2.5 × 10^k only when the reporting step can write it', () => {
    // 132.5 is not a reportable sodium result: whole-number data get ticks in whole numbers.
    expect(niceAxis(131, 143, { count: 5 }).ticks).toContain(132.5);
    const whole = niceAxis(131, 143, { count: 5, resolution: 1 });
    expect(whole.ticks.every(Number.isInteger)).toBe(true);
    expect(whole.decimals).toBe(0);
    // Never a tick step finer than the reporting step.
    expect(niceAxis(4, 6, { count: 10, resolution: 1 }).step).toBe(1);
  });

  it('widens a range of one value into an axis around it', () => {
    const a = niceAxis(5, 5);
    expect(a.min).toBeLessThan(5);
    expect(a.max).toBeGreaterThan(5);
  });
});

describe('padded axes', () => {
  it('pads the domain by a share of the span on both sides', () => {
    expect(paddedDomain([2, 12])).toEqual([1.5, 12.5]);
    expect(paddedDomain([2, 12, NaN, Infinity], { share: 0.1 })).toEqual([1, 13]);
    expect(paddedDomain([], {})).toEqual([0, 1]);
    expect(paddedDomain([4, 4])).toEqual([3.8, 4.2]);
  });

  it('keeps every extreme point strictly inside the axis, also when the extremes are round numbers', () => {
    // Without padding 0 and 30 would be the axis ends and the points on them would be half cut away.
    for (const values of [[0, 7.5, 30], [3, 20], [-0.2, 0.7], [140, 140], [0.001, 0.004]]) {
      const axis = paddedAxis(values);
      const margin = (Math.max(...values) - Math.min(...values) || Math.abs(values[0])) * 0.05;
      expect(axis.min).toBeLessThanOrEqual(Math.min(...values) - margin + 1e-12);
      expect(axis.max).toBeGreaterThanOrEqual(Math.max(...values) + margin - 1e-12);
    }
    expect(niceAxis(0, 30).min).toBe(0); // what the unpadded axis does
    expect(paddedAxis([0, 30]).min).toBeLessThan(0);
  });
});

describe('histogram bins at half-steps of the reporting step', () => {
  it('picks about √n bins, 8 to 30, and 1, 2, 5, 10 … steps per bin', () => {
    expect([20, 120, 5000].map(binTarget)).toEqual([8, 11, 30]);
    expect(binSteps(8, 11)).toBe(1);
    expect(binSteps(23, 11)).toBe(5);
    expect(binSteps(150, 11)).toBe(20);
  });

  it('reads the reporting step from the data when none is given', () => {
    expect(dataStep([4.1, 3.95, 5])).toBe(0.01);
    expect(dataStep([140, 141])).toBe(1);
    expect(dataStep([])).toBe(1);
  });

  it('never puts an edge on a reportable value, and counts every value once', () => {
    const values = wholeNumbers();
    const bins = resolutionBins(values, 1);
    expect(bins.reduce((s, b) => s + b.count, 0)).toBe(values.length);
    for (const b of bins) {
      expect(Math.abs(b.from - Math.round(b.from))).toBeCloseTo(0.5, 9);
      expect(Math.abs(b.to - Math.round(b.to))).toBeCloseTo(0.5, 9);
    }
    const widths = new Set(bins.map((b) => clean(b.to - b.from)));
    expect(widths.size).toBe(1);
    expect(bins[0].count).toBeGreaterThan(0);
    expect(bins[bins.length - 1].count).toBeGreaterThan(0);
    for (const v of values) expect(bins.filter((b) => v >= b.from && v < b.to)).toHaveLength(1);
  });

  it('gives whole-number data no alternate-bin piling, where equal-width bins over [min, max] do', () => {
    // Every whole number from 60 to 79 reported 6 times: a flat distribution. The min–max bins (the engine's
    // histogram for bootstrap replicates) are 20/11 ≈ 1.8 units wide, so some hold two reportable values
    // and others one: the counts jump 12, 6, 12, 6 ... although the data are flat.
    const values = Array.from({ length: 120 }, (_, k) => 60 + (k % 20));
    const naive = histogram(Float64Array.from(values), binTarget(values.length)).bins.map((b) => b.count);
    expect(Math.max(...naive)).toBeGreaterThanOrEqual(2 * Math.min(...naive));
    const bins = resolutionBins(values, 1);
    expect(bins.map((b) => b.from)).toEqual(Array.from({ length: 20 }, (_, k) => 59.5 + k));
    expect(bins.map((b) => b.count)).toEqual(new Array(20).fill(6));
    // Spread over more values, bins of several steps: 25 whole numbers in bins of 5, still flat.
    const wide = resolutionBins(Array.from({ length: 125 }, (_, k) => 60 + (k % 25)), 1);
    expect(wide.map((b) => [b.from, b.count])).toEqual([[59.5, 25], [64.5, 25], [69.5, 25], [74.5, 25], [79.5, 25]]);
  });

  it('bins decimal results at half-steps of their own step', () => {
    const values = [3.5, 3.6, 3.6, 3.7, 4.0, 4.4, 4.9, 5.0, 5.1, 5.8];
    const bins = resolutionBins(values, 0.1, 8);
    expect(bins[0].from).toBe(3.45);
    expect(bins.map((b) => clean(b.to - b.from))).toEqual(new Array(bins.length).fill(0.5));
    expect(bins.reduce((s, b) => s + b.count, 0)).toBe(values.length);
    expect(resolutionBins([], 1)).toEqual([]);
    expect(resolutionBins([7, 7, 7], 1)).toEqual([{ from: 6.5, to: 7.5, count: 3 }]);
    expect(resolutionBins([3.5, 3.6, 3.9], 0.1).map((b) => b.from)).toEqual([3.45, 3.55, 3.65, 3.75, 3.85]);
    // Whole numbers under a stated step of 0.1 are binned in whole steps: no empty bin between two numbers.
    expect(resolutionBins([4, 5, 5, 6, 7, 8, 9], 0.1).map((b) => [b.from, b.count])).toEqual([[3.5, 1], [4.5, 2], [5.5, 1], [6.5, 1], [7.5, 1], [8.5, 1]]);
  });
});

describe('valueBins: the one histogram rule of the findings page and the PDF', () => {
  const edges = (r: ReturnType<typeof valueBins>) => ({ step: r.step, bins: r.bins.map((b) => [b.from, b.to, b.count]) });

  it.each([
    ['sodium, whole numbers, stated step 1', [138, 139, 139, 140, 140, 140, 141, 143], 1,
      { step: 1, bins: [[137.5, 138.5, 1], [138.5, 139.5, 2], [139.5, 140.5, 3], [140.5, 141.5, 1], [141.5, 142.5, 0], [142.5, 143.5, 1]] }],
    ['whole numbers under a stated step of 0.1: the values\' own step', [4, 5, 5, 7], 0.1,
      { step: 1, bins: [[3.5, 4.5, 1], [4.5, 5.5, 2], [5.5, 6.5, 0], [6.5, 7.5, 1]] }],
    ['no step stated (older results): the values\' own', [3.5, 3.6, 3.6, 3.8], null,
      { step: 0.1, bins: [[3.45, 3.55, 1], [3.55, 3.65, 2], [3.65, 3.75, 0], [3.75, 3.85, 1]] }],
    ['a stated step of 0.5, coarser than the values', [1, 1.5, 1.5, 2.5], 0.5,
      { step: 0.5, bins: [[0.75, 1.25, 1], [1.25, 1.75, 2], [1.75, 2.25, 0], [2.25, 2.75, 1]] }],
    // 31 values over 31 steps: target max(8, round(√31)) = 8 bins; 1 and 2 steps a bin give more, 5 gives 7; edges at multiples of 5 steps.
    ['100 to 130 once each: bins of 5 steps', Array.from({ length: 31 }, (_, k) => 100 + k), 1,
      { step: 1, bins: [[99.5, 104.5, 5], [104.5, 109.5, 5], [109.5, 114.5, 5], [114.5, 119.5, 5], [119.5, 124.5, 5], [124.5, 129.5, 5], [129.5, 134.5, 1]] }],
  ])('%s', (_, values, resolution, expected) => {
    expect(edges(valueBins(values as number[], resolution as number | null))).toEqual(expected);
  });

  it('gives the bins resolutionBins gives, with binStep as their step', () => {
    const values = [4.1, 4.4, 5.0, 5.9, 6.3];
    expect(valueBins(values, 0.1)).toEqual({ step: binStep(values, 0.1), bins: resolutionBins(values, 0.1) });
    expect([binStep(values, 0.1), binStep(values, 1), binStep(values, null), binStep(values, 0), binStep([], null)]).toEqual([0.1, 1, 0.1, 0.1, 1]);
  });
});
