import { jStat } from 'jstat';
import { choiceOption, integerOption, isLevel, LEVEL_RULE, numberListOption, numberOption, OptionError } from './options';
import { binomialRankCi } from './rank-ci';

/**
 * What more reference individuals buy when establishing an interval: for each n, the rank-based CI of each limit
 * (rank-ci.ts: the order statistics x(r) and x(s), exact binomial coverage) and its expected width.
 * - In percentile points, exactly and for any population: F(x(k)) of a sample of n is Beta(k, n − k + 1), whose
 *   mean is k/(n + 1), so the CI spans on average (s − r)/(n + 1) of the population (David & Nagaraja, Order
 *   Statistics, 3rd ed. 2003, §2.2 [memory for the section]).
 * - In the unit, for a presumed population whose central 95% runs from `lower` to `upper` (normal, or log-normal:
 *   normal on the log scale): E[x(s)] − E[x(r)], each expectation ∫ Q(u)·Beta(u; k, n − k + 1) du computed by
 *   Simpson's rule on the normal scale z (u = Φ(z), 4,000 panels from −9 to 9; reference-checks/plan.check.ts checks
 *   it against scipy's numerical integration and against published expected normal order statistics).
 */
export type PopulationShape = 'normal' | 'log-normal';

export interface EstablishPlanOptions {
  n?: number[];
  percentiles?: number[];
  /** The level of the CI of each limit (0.90 by CLSI EP28-A3c practice). */
  level?: number;
  /** A presumed population, for widths in the unit: its central 95% from lower to upper. */
  population?: { shape?: PopulationShape; lower?: number; upper?: number } | null;
}

export interface EstablishLimitPlan {
  percentile: number;
  /** Null when no CI at this level exists for this n (n below 119 for the 2.5th and 97.5th at 90%). */
  lowerRank: number | null;
  upperRank: number | null;
  coverage: number | null;
  /** Expected share of the population between the CI's ends, in percentile points. */
  expectedSpan: number | null;
  /** Expected width of the CI in the unit, for the presumed population; null without one. */
  expectedWidth: number | null;
}

export interface EstablishPlanResult {
  kind: 'plan-establish';
  level: number;
  population: { shape: PopulationShape; lower: number; upper: number } | null;
  rows: { n: number; limits: EstablishLimitPlan[] }[];
}

export const ESTABLISH_GRID = [120, 150, 200, 240, 300, 400] as const;

/** @throws OptionError naming the first bad option */
export function planEstablish(o: EstablishPlanOptions = {}): EstablishPlanResult {
  const grid = numberListOption('n', o.n ?? [...ESTABLISH_GRID], (v) => Number.isInteger(v) && v >= 2 && v <= 100_000, 'a whole number from 2 to 100,000');
  if (grid.length === 0 || grid.length > 12) throw new OptionError('n', 'must list 1 to 12 numbers of individuals');
  const percentiles = numberListOption('percentiles', o.percentiles ?? [2.5, 97.5], (v) => v > 0 && v < 100, 'between 0 and 100');
  const level = numberOption('level', o.level, 0.9, isLevel, LEVEL_RULE);
  const population = o.population ? resolvePopulation(o.population) : null;
  const rows = [...new Set(grid)].sort((a, b) => a - b).map((n) => ({
    n,
    limits: percentiles.map((pc): EstablishLimitPlan => {
      const ci = binomialRankCi(n, pc / 100, level);
      if (!ci) return { percentile: pc, lowerRank: null, upperRank: null, coverage: null, expectedSpan: null, expectedWidth: null };
      return {
        percentile: pc, lowerRank: ci.lowerRank, upperRank: ci.upperRank, coverage: ci.coverage,
        expectedSpan: (100 * (ci.upperRank - ci.lowerRank)) / (n + 1),
        expectedWidth: population ? expectedOrderStatistic(population, n, ci.upperRank) - expectedOrderStatistic(population, n, ci.lowerRank) : null,
      };
    }),
  }));
  return { kind: 'plan-establish', level, population, rows };
}

function resolvePopulation(p: NonNullable<EstablishPlanOptions['population']>): { shape: PopulationShape; lower: number; upper: number } {
  const shape = choiceOption('population.shape', p.shape, 'normal', ['normal', 'log-normal'] as const);
  const lower = numberOption('population.lower', p.lower, NaN, Number.isFinite, 'a number');
  if (!Number.isFinite(lower)) throw new OptionError('population.lower', 'is required with a presumed population');
  const upper = numberOption('population.upper', p.upper, NaN, (v) => v > lower, `a number above the lower limit (${lower})`);
  if (!Number.isFinite(upper)) throw new OptionError('population.upper', 'is required with a presumed population');
  if (shape === 'log-normal' && !(lower > 0)) throw new OptionError('population.lower', 'must be above 0 for a log-normal population');
  return { shape, lower, upper };
}

const Z975 = 1.959963984540054;
const PANELS = 4000;
const Z_SPAN = 9;

/** E[x(k)] of a sample of n from the presumed population (Simpson's rule over z, u = Φ(z)). */
export function expectedOrderStatistic(pop: { shape: PopulationShape; lower: number; upper: number }, n: number, k: number): number {
  const log = pop.shape === 'log-normal';
  const lo = log ? Math.log(pop.lower) : pop.lower;
  const hi = log ? Math.log(pop.upper) : pop.upper;
  const mu = (lo + hi) / 2;
  const sigma = (hi - lo) / (2 * Z975);
  const logBeta = jStat.betaln(k, n - k + 1);
  const h = (2 * Z_SPAN) / PANELS;
  let sum = 0;
  for (let i = 0; i <= PANELS; i++) {
    const z = -Z_SPAN + i * h;
    const below = jStat.normal.cdf(z, 0, 1);
    const above = jStat.normal.cdf(-z, 0, 1);
    if (below <= 0 || above <= 0) continue;
    const density = Math.exp((k - 1) * Math.log(below) + (n - k) * Math.log(above) - logBeta - 0.5 * z * z) / Math.sqrt(2 * Math.PI);
    const value = log ? Math.exp(mu + sigma * z) : mu + sigma * z;
    sum += (i === 0 || i === PANELS ? 1 : i % 2 === 1 ? 4 : 2) * value * density;
  }
  return (sum * h) / 3;
}
