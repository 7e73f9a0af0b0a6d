/** The workloads of `npm run bench`: the engine's version and the sort-per-resample version of each. */
import { analyzeComparison } from '@shared/stats';
import { medianReplicates } from '@shared/stats/bootstrap';
import { summariseReplicates } from '@shared/stats/bootstrap-estimate';
import { medianFromCounts } from '@shared/stats/counts-stats';
import { resolveIntervalOptions } from '@shared/stats/interval-options';
import { sortedCopy } from '@shared/stats/quantile';
import { referenceInterval } from '@shared/stats/reference-interval';
import { streamFor, Xor128 } from '@shared/stats/rng';
import { shiftedNullTest } from '@shared/stats/shifted-null-test';
import { naiveDifferenceParts, naiveIntervalCi, naiveMedianCi, naiveMedianTest, naivePassingBablokBootstrap } from './bench-naive';

export const SEED = 'bench';
/** The resamples of every workload; a naive run given fewer is scaled up to this many by the caller. */
export const FULL_B = 10_000;
export const REGRESSION_RESAMPLES = 2000;
/** Above this n the naive Passing–Bablok bootstrap is timed on a fraction of its resamples and scaled up. */
const NAIVE_PB_FULL_UP_TO = 120;
/** Above this n the naive Passing–Bablok bootstrap is not timed at all: one resample's table is 50 million slopes (1.8 GB) at n = 10,000. */
const NAIVE_PB_MAX = 3000;

export interface Workload {
  name: string;
  engine(n: number, B: number): void;
  naive(n: number, B: number): void;
  note(n: number): string | undefined;
}

/** Invented data (seeded): results to 1 decimal, x from 2 to 50, y = 1.02x + 0.3 + noise. */
export function benchData(n: number): { values: Float64Array; x: Float64Array; y: Float64Array } {
  const s = new Xor128(`bench-data-${n}`);
  const noise = (): number => (s.nextUniform() + s.nextUniform() + s.nextUniform() - 1.5) * 0.8;
  const x = Float64Array.from({ length: n }, () => Math.round((2 + 48 * s.nextUniform()) * 10) / 10);
  const y = x.map((v) => Math.round((1.02 * v + 0.3 + noise()) * 10) / 10);
  const values = Float64Array.from({ length: n }, () => Math.round((40 + 10 * noise() * 3) * 10) / 10);
  return { values, x, y };
}

const regressionFor = (_n: number) => 'passing-bablok' as 'passing-bablok' | 'deming';

export const WORKLOADS: Workload[] = [
  {
    name: 'median-ci',
    engine(n, B) {
      const sorted = sortedCopy(benchData(n).values);
      const reps = medianReplicates(sorted, { resamples: B, stream: streamFor(SEED, 'differences') });
      summariseReplicates(reps, sorted[n >> 1], 0.95, 'percentile');
    },
    naive: (n, B) => void naiveMedianCi(benchData(n).values, B, SEED),
    note: () => undefined,
  },
  {
    name: 'median-test',
    engine: (n, B) => void shiftedNullTest(sortedCopy(benchData(n).values), medianFromCounts, 0, { resamples: B, stream: streamFor(SEED, 'null-median') }),
    naive: (n, B) => void naiveMedianTest(benchData(n).values, B, SEED),
    note: () => undefined,
  },
  {
    name: 'interval-ci',
    engine: (n, B) => void referenceInterval(benchData(n).values, resolveIntervalOptions({ resamples: B, seed: SEED }), 'interval'),
    naive: (n, B) => void naiveIntervalCi(benchData(n).values, B, SEED),
    note: () => undefined,
  },
  {
    name: 'comparison',
    engine(n, B) {
      const { x, y } = benchData(n);
      analyzeComparison(Array.from(x, (xi, i) => ({ x: xi, y: y[i] })),
        { resamples: B, regressionResamples: REGRESSION_RESAMPLES, seed: SEED, regression: regressionFor(n), decisionLevels: [10, 40] });
    },
    naive(n, B) {
      const { x, y } = benchData(n);
      naiveDifferenceParts(y.map((v, i) => v - x[i]), B, SEED);
      if (regressionFor(n) !== 'passing-bablok' || n > NAIVE_PB_MAX) return;
      const target = (REGRESSION_RESAMPLES * B) / FULL_B;
      const part = n <= NAIVE_PB_FULL_UP_TO ? target : Math.max(2, Math.round(target * (NAIVE_PB_FULL_UP_TO / n) ** 2));
      const start = performance.now();
      naivePassingBablokBootstrap(x, y, part, SEED);
      const spent = performance.now() - start;
      busyCredit += (spent * target) / part - spent;
    },
    note: (n) => [
      `regression ${regressionFor(n)}, ${REGRESSION_RESAMPLES} regression resamples`,
      regressionFor(n) === 'passing-bablok' && n > NAIVE_PB_MAX ? 'naive versions time the difference part only: the naive Passing–Bablok bootstrap would list 50 million slopes per resample, so the speed-up column does not apply' : '',
      regressionFor(n) === 'passing-bablok' && n > NAIVE_PB_FULL_UP_TO && n <= NAIVE_PB_MAX ? 'naive Passing–Bablok bootstrap timed on a fraction of its resamples and scaled to 2,000' : '',
    ].filter(Boolean).join('; '),
  },
];

/** Time that a naive run did not spend but is charged for (the scaled-up part of a timed fraction). */
export let busyCredit = 0;
export function takeCredit(): number {
  const c = busyCredit;
  busyCredit = 0;
  return c;
}
