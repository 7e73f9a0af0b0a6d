import seedrandom from 'seedrandom';

const gaussian = (rng: () => number) => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());

/**
 * Invented linearity results: `replicates` results at each level's value x around truth(x), with a proportional SD
 * `cv` (a fraction) and a constant SD `sd`, to `decimals`. Deterministic for a seed.
 */
export function rangeResults(
  seed: string, levels: { name: string; x: number }[], replicates: number, truth: (x: number) => number, cv: number, sd: number, decimals: number,
) {
  const rng = seedrandom(seed);
  return levels.flatMap((l) => Array.from({ length: replicates }, (_, k) => ({
    level: l.name, replicate: k + 1, value: (truth(l.x) * (1 + cv * gaussian(rng)) + sd * gaussian(rng)).toFixed(decimals),
  })));
}

const POOL_LOW = 0.3;
const POOL_HIGH = 32.3;
/** Nine mixtures in eighths of the high pool, so every assigned value is exact: 0.3, 4.3, …, 32.3 mmol/L. */
const LEVELS = Array.from({ length: 9 }, (_, i) => ({ name: `Level ${i + 1}`, fraction: i / 8 }));

/** The demo's settings (server/kinds/reportable-range/demo.ts), also what the e2e types into Setup. */
export const RANGE_DEMO_SETTINGS = {
  seed: 'vh-glucose-range-2026', decimals: 2, reagentLot: 'GLU-4502', runsFrom: '2026-11-23', runsTo: '2026-11-23', resamples: 10000,
  levels: LEVELS.map((l) => ({ name: l.name, fraction: l.fraction, assigned: null })),
  poolLow: POOL_LOW, poolHigh: POOL_HIGH, replicates: 2,
  allowableNonlinearity: 0.5, allowableNonlinearityPercent: 1.5,
  nonlinearitySource: 'Laboratory quality goal for glucose linearity, set by the director (invented)',
  claimedLow: 0.3, claimedHigh: 32, alpha: 0.05,
};

/** Two results a level; the response bends down above about 22 mmol/L (an invented scenario). */
export const RANGE_DEMO_ROWS = rangeResults('vh-rr-3', LEVELS.map((l) => ({ name: l.name, x: POOL_LOW + l.fraction * (POOL_HIGH - POOL_LOW) })), 2,
  (x) => x - 0.014 * Math.max(0, x - 22) ** 2, 0.004, 0.02, 2);
