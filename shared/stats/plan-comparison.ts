import type { ProgressFn } from './bootstrap';
import { allowableBiasAt, verdict } from './decision-levels';
import { judgedInterval, narrowerThanStep } from './resolution';
import type { DifferenceType } from './differences';
import { engineInfo, type EngineInfo } from './engine';
import { jsonClean } from './json-clean';
import { choiceOption, integerOption, isLevel, LEVEL_RULE, numberListOption, numberOption, OptionError, optionalNumber, seedOption } from './options';
import { median } from './quantile';
import { regression } from './regression';
import type { RegressionMethod } from './regression-fitters';
import { REGRESSION_METHODS, DIFFERENCE_TYPES } from './comparison-options';
import { streamFor, type Xor128 } from './rng';

/**
 * Planning a method comparison by simulation (the approach of Linnet, Clin Chem 1999;45:882: simulate the planned
 * study under a stated truth and count how often it reaches its conclusion).
 *
 * The truth: a specimen's true concentration T is drawn from the planned range (uniform or log-uniform between
 * `low` and `high`, or drawn with replacement from the comparative values of an earlier study); the comparative
 * method reads x = T + e_x and the candidate y = T + δ + e_y, with normal errors of SD `cvComparative` and
 * `cvCandidate` (constant model) or of CV % at T (proportional model), and δ the true bias, the same at every
 * concentration. Both results are rounded to the reporting step (`decimals`) before the true bias is added, so
 * the candidate's results carry the rounding error real results carry (and Passing–Bablok's exact integer
 * slope selection applies).
 *
 * Each simulated study is analysed with the engine's own regression (regression.ts: the planned method, its CIs
 * by bootstrap of pairs with `resamples` resamples, fewer than a real analysis for speed, the same code) and the
 * verdict at each decision level is the engine's own (decision-levels.ts): "within" when the whole CI of the
 * bias at Xc lies within the allowable bias there; where the CI is narrower than the reporting step, judged on the
 * estimate ± step/2 joined with the CI, as the analysis does (resolution.ts).
 *
 * Three truths per decision level: δ = 0, δ = half the allowable bias at Xc (the power), δ = the allowable bias
 * at Xc (the risk of a false pass). Ordinary least squares, Deming and Passing–Bablok are equivariant under a
 * shift of y (every resample's line moves up by δ, the slope stays), so one analysis of the data with δ = 0
 * gives all three: the CI under δ is the CI under 0 moved by δ (plan-comparison.spec.ts checks this against
 * analyses of shifted data). Weighted Deming is not (its weights depend on the concentration): its data are
 * simulated and analysed once per truth, from the same draws.
 *
 * Every figure is a proportion of `simulations` studies, with Monte Carlo standard error √(p(1 − p)/S)
 * (at most 1.6 percentage points for S = 1,000). The same seed gives the same figures.
 */
export type PlanErrorModel = 'constant' | 'proportional';
export type PlanShape = 'uniform' | 'log-uniform' | 'values';

export interface ComparisonPlanOptions {
  /** SD of the comparative method's error (constant model, in the unit) or its CV in % (proportional model). */
  cvComparative?: number;
  cvCandidate?: number;
  errorModel?: PlanErrorModel;
  low?: number;
  high?: number;
  shape?: PlanShape;
  /** For shape 'values': the comparative values of an earlier study, drawn with replacement. */
  values?: number[];
  regression?: RegressionMethod;
  differenceType?: DifferenceType;
  /** λ = σ²(x error)/σ²(y error); default from the imprecision given: (cvComparative / cvCandidate)². */
  demingRatio?: number;
  decisionLevels?: number[];
  allowableBias?: number | null;
  allowableBiasPercent?: number | null;
  n?: number[];
  simulations?: number;
  seed?: string;
  level?: number;
  /** The reporting decimals results are rounded to; default: a step at most a fifth of the smallest error SD. */
  decimals?: number;
  /** Bootstrap resamples per simulated study. */
  resamples?: number;
  targetPower?: number;
  maxFalsePass?: number;
}

export interface ResolvedComparisonPlan {
  cvComparative: number;
  cvCandidate: number;
  errorModel: PlanErrorModel;
  low: number;
  high: number;
  shape: PlanShape;
  values: number[] | null;
  regression: RegressionMethod;
  differenceType: DifferenceType;
  demingRatio: number;
  decisionLevels: number[];
  allowableBias: number | null;
  allowableBiasPercent: number | null;
  n: number[];
  simulations: number;
  seed: string;
  level: number;
  decimals: number;
  resamples: number;
  targetPower: number;
  maxFalsePass: number;
}

export interface PlanLevelFigures {
  level: number;
  /** The allowable bias at the level (the larger of the absolute and the % goal). */
  allowable: number;
  /** P(within) when the true bias is 0. */
  powerAtZero: number;
  /** P(within) when the true bias is half the allowable bias: the power. */
  powerAtHalf: number;
  /** P(within) when the true bias equals the allowable bias: the risk of a false pass. */
  falsePass: number;
  /** The median over the simulated studies of the half-width of the CI of the bias at the level. */
  medianHalfWidth: number | null;
}

export interface PlanRow { n: number; levels: PlanLevelFigures[] }

export interface ComparisonPlanResult {
  kind: 'plan-comparison';
  rows: PlanRow[];
  /** The smallest n on the grid meeting both targets at every level; null when none does (`reason` says why). */
  recommendedN: number | null;
  reason: string;
  simulations: number;
  seed: string;
  /** Bootstrap resamples per simulated study (fewer than a real analysis, for speed). */
  resamples: number;
  targetPower: number;
  maxFalsePass: number;
  settings: ResolvedComparisonPlan;
  warnings: string[];
  engine: EngineInfo;
}

export const PLAN_DEFAULTS = { simulations: 1000, resamples: 200, targetPower: 0.8, maxFalsePass: 0.05, n: [40, 60, 80, 100, 120, 160, 200] } as const;
export const PLAN_LIMITS = { simulations: [100, 20_000], resamples: [100, 5000], n: [5, 2000], gridPoints: 12 } as const;

/** @throws OptionError naming the first bad option */
export function resolveComparisonPlan(o: ComparisonPlanOptions): ResolvedComparisonPlan {
  const positive = (v: number) => v > 0;
  const errorModel = choiceOption('errorModel', o.errorModel, 'constant', ['constant', 'proportional'] as const);
  const cvComparative = required('cvComparative', o.cvComparative, positive, errorModel === 'constant' ? 'an SD above 0' : 'a CV in % above 0');
  const cvCandidate = required('cvCandidate', o.cvCandidate, positive, errorModel === 'constant' ? 'an SD above 0' : 'a CV in % above 0');
  const shape = choiceOption('shape', o.shape, 'uniform', ['uniform', 'log-uniform', 'values'] as const);
  const values = shape === 'values' ? numberListOption('values', o.values, Number.isFinite, 'finite') : null;
  if (values && values.length < 2) throw new OptionError('values', 'must hold at least 2 comparative values of the earlier study');
  const low = values ? Math.min(...values) : required('low', o.low, Number.isFinite, 'a number');
  const high = values ? Math.max(...values) : required('high', o.high, (v) => v > low, `a number above low (${low})`);
  if (shape === 'log-uniform' && !(low > 0)) throw new OptionError('low', 'must be above 0 for a log-uniform range');
  const regressionMethod = choiceOption('regression', o.regression, 'passing-bablok', REGRESSION_METHODS);
  const decisionLevels = numberListOption('decisionLevels', o.decisionLevels, Number.isFinite, 'finite');
  if (decisionLevels.length === 0) throw new OptionError('decisionLevels', 'must name at least one decision level: the plan judges the bias there');
  const allowableBias = optionalNumber('allowableBias', o.allowableBias, positive, 'a number above 0');
  const allowableBiasPercent = optionalNumber('allowableBiasPercent', o.allowableBiasPercent, positive, 'a number above 0');
  if (allowableBias === null && allowableBiasPercent === null) throw new OptionError('allowableBias', 'or allowableBiasPercent must be given: the plan judges the bias against it');
  const zeroGoal = decisionLevels.find((l) => allowableBiasAt(l, allowableBias, allowableBiasPercent) === 0);
  if (zeroGoal !== undefined) throw new OptionError('decisionLevels', `has a level (${zeroGoal}) where the allowable bias is 0 (a percentage of 0): no study can end within it; give an absolute allowable bias too`);
  const n = numberListOption('n', o.n ?? [...PLAN_DEFAULTS.n], (v) => Number.isInteger(v) && v >= PLAN_LIMITS.n[0] && v <= PLAN_LIMITS.n[1], `a whole number from ${PLAN_LIMITS.n[0]} to ${PLAN_LIMITS.n[1]}`);
  if (n.length === 0 || n.length > PLAN_LIMITS.gridPoints) throw new OptionError('n', `must list 1 to ${PLAN_LIMITS.gridPoints} numbers of specimens`);
  const grid = [...new Set(n)].sort((a, b) => a - b);
  return {
    cvComparative, cvCandidate, errorModel, low, high, shape, values,
    regression: regressionMethod,
    differenceType: choiceOption('differenceType', o.differenceType, 'absolute', DIFFERENCE_TYPES),
    demingRatio: numberOption('demingRatio', o.demingRatio, (cvComparative / cvCandidate) ** 2, positive, 'a positive number'),
    decisionLevels, allowableBias, allowableBiasPercent,
    n: grid,
    simulations: integerOption('simulations', o.simulations, PLAN_DEFAULTS.simulations, ...PLAN_LIMITS.simulations),
    seed: seedOption(o.seed),
    level: numberOption('level', o.level, 0.95, isLevel, LEVEL_RULE),
    decimals: integerOption('decimals', o.decimals, defaultDecimals(errorModel, Math.min(cvComparative, cvCandidate), low, high), 0, 6),
    resamples: integerOption('resamples', o.resamples, PLAN_DEFAULTS.resamples, ...PLAN_LIMITS.resamples),
    targetPower: numberOption('targetPower', o.targetPower, PLAN_DEFAULTS.targetPower, isLevel, LEVEL_RULE),
    maxFalsePass: numberOption('maxFalsePass', o.maxFalsePass, PLAN_DEFAULTS.maxFalsePass, isLevel, LEVEL_RULE),
  };
}

/** Decimals whose step is at most a fifth of the smallest error SD in the range (0 to 6). */
function defaultDecimals(model: PlanErrorModel, smallest: number, low: number, high: number): number {
  const sd = model === 'constant' ? smallest : (smallest / 100) * Math.max(Math.min(Math.abs(low), Math.abs(high)), 1e-6);
  return Math.min(6, Math.max(0, Math.ceil(-Math.log10(sd / 5))));
}

function required(option: string, value: unknown, check: (v: number) => boolean, rule: string): number {
  if (value === undefined || value === null) throw new OptionError(option, `is required: give ${rule}`);
  return numberOption(option, value, 0, check, rule);
}

/** A standard normal deviate (Box–Muller, the cosine branch) from two uniforms of the stream. */
function normal(s: Xor128): number {
  const u = (s.nextInt32() >>> 0) / 4294967296 + 1 / 8589934592; // in (0, 1): never log(0)
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * s.nextUniform());
}

/**
 * Draws one planned study with no bias: x and y, each the true concentration plus its method's error, rounded to
 * the reporting step.
 */
function drawStudy(p: ResolvedComparisonPlan, n: number, s: Xor128, x: Float64Array, y: Float64Array): void {
  const scale10 = 10 ** p.decimals;
  const logLow = p.shape === 'log-uniform' ? Math.log(p.low) : 0;
  const logSpan = p.shape === 'log-uniform' ? Math.log(p.high) - logLow : 0;
  for (let i = 0; i < n; i++) {
    const c = p.values ? p.values[s.nextIndex(p.values.length)]
      : p.shape === 'log-uniform' ? Math.exp(logLow + logSpan * s.nextUniform())
        : p.low + (p.high - p.low) * s.nextUniform();
    const scale = p.errorModel === 'constant' ? 1 : Math.abs(c) / 100;
    x[i] = Math.round((c + p.cvComparative * scale * normal(s)) * scale10) / scale10;
    y[i] = Math.round((c + p.cvCandidate * scale * normal(s)) * scale10) / scale10;
  }
}

/** The bias at a decision level of one simulated study: its estimate and CI (null where the engine gives none). */
type LevelCi = { estimate: number; ci: [number, number] } | null;

/**
 * Whether a level's bias, moved by `moveBy`, ends "within": judged as the analysis judges it (core-comparison.ts),
 * on the CI, or where the CI is narrower than the reporting step on the estimate ± step/2 joined with the CI.
 */
function endsWithin(b: LevelCi, moveBy: number, allowable: number, step: number): boolean {
  if (!b) return false;
  const ci: [number, number] = [b.ci[0] + moveBy, b.ci[1] + moveBy];
  return verdict(narrowerThanStep(ci, step) ? judgedInterval(b.estimate + moveBy, ci, step) : ci, allowable) === 'within';
}

/** Shift-equivariant methods: one analysis serves every true bias. */
const EQUIVARIANT: ReadonlySet<RegressionMethod> = new Set(['ols', 'deming', 'passing-bablok']);

/**
 * The CIs of the bias at each decision level for one simulated study with true bias `shift`, or null for a level
 * where the engine gives none (no defined line, too few usable resamples).
 */
function levelCis(p: ResolvedComparisonPlan, x: Float64Array, y: Float64Array, stream: Xor128): LevelCi[] {
  try {
    const fit = regression(x, y, {
      method: p.regression, lambda: p.demingRatio, level: p.level, interval: 'percentile', ciMethod: 'bootstrap',
      decisionLevels: p.decisionLevels, settings: { resamples: p.resamples, stream }, bandPoints: 0,
    });
    return fit.decisionLevelBias.map((b) => (b.ci && Number.isFinite(b.ci[0]) && Number.isFinite(b.ci[1]) && Number.isFinite(b.estimate) ? { estimate: b.estimate, ci: [b.ci[0], b.ci[1]] } : null));
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    return p.decisionLevels.map(() => null);
  }
}

/**
 * Runs the plan: for each n of the grid, `simulations` studies. Study j at size n takes its draws from the stream
 * `plan:n:j` of the seed, so a figure does not change when the grid around it changes.
 */
export function planComparison(options: ComparisonPlanOptions, onProgress?: ProgressFn): ComparisonPlanResult {
  const p = resolveComparisonPlan(options);
  const allowable = p.decisionLevels.map((l) => allowableBiasAt(l, p.allowableBias, p.allowableBiasPercent)!);
  const scenarios = [0, 0.5, 1];
  const equivariant = EQUIVARIANT.has(p.regression);
  const reportingStep = 10 ** -p.decimals;
  const total = p.n.length * p.simulations;
  const step = Math.max(1, Math.floor(total / 100));
  let done = 0;
  const rows: PlanRow[] = p.n.map((n) => {
    const x = new Float64Array(n);
    const y0 = new Float64Array(n);
    const y = new Float64Array(n);
    const within = p.decisionLevels.map(() => [0, 0, 0]);
    const halfWidths = p.decisionLevels.map(() => [] as number[]);
    for (let j = 0; j < p.simulations; j++) {
      const draws = streamFor(p.seed, `plan:${n}:${j}`);
      drawStudy(p, n, draws, x, y0);
      const judge = (k: number, s: number, b: LevelCi, moveBy: number) => {
        if (endsWithin(b, moveBy, allowable[k], reportingStep)) within[k][s]++;
      };
      if (equivariant) {
        const cis = levelCis(p, x, y0, streamFor(p.seed, `plan:${n}:${j}:regression`));
        cis.forEach((b, k) => {
          if (b) halfWidths[k].push((b.ci[1] - b.ci[0]) / 2);
          scenarios.forEach((f, s) => judge(k, s, b, f * allowable[k]));
        });
      } else {
        // One analysis per distinct true bias, each from the same draws and resampling stream.
        const shifts = [...new Set(allowable.flatMap((a) => scenarios.map((f) => f * a)))];
        const byShift = new Map<number, LevelCi[]>();
        for (const shift of shifts) {
          for (let i = 0; i < n; i++) y[i] = y0[i] + shift;
          byShift.set(shift, levelCis(p, x, y, streamFor(p.seed, `plan:${n}:${j}:regression`)));
        }
        allowable.forEach((a, k) => {
          const atZero = byShift.get(0)![k];
          if (atZero) halfWidths[k].push((atZero.ci[1] - atZero.ci[0]) / 2);
          scenarios.forEach((f, s) => judge(k, s, byShift.get(f * a)![k], 0));
        });
      }
      done++;
      if (onProgress && done % step === 0) onProgress(done / total);
    }
    return {
      n,
      levels: p.decisionLevels.map((level, k) => ({
        level,
        allowable: allowable[k],
        powerAtZero: within[k][0] / p.simulations,
        powerAtHalf: within[k][1] / p.simulations,
        falsePass: within[k][2] / p.simulations,
        medianHalfWidth: halfWidths[k].length ? median(halfWidths[k]) : null,
      })),
    };
  });
  onProgress?.(1);
  return finishPlan(p, rows);
}

/**
 * One plan from plans run on parts of the same grid (in parallel threads): the same figures as one run over the
 * whole grid, since study j at size n draws from its own stream whatever else is simulated.
 */
export function mergePlans(parts: ComparisonPlanResult[]): ComparisonPlanResult {
  if (parts.length === 0) throw new RangeError('mergePlans needs at least one part');
  const rows = parts.flatMap((part) => part.rows).sort((a, b) => a.n - b.n);
  return finishPlan({ ...parts[0].settings, n: rows.map((r) => r.n) }, rows);
}

/** The grid split into `parts` groups of about equal work (the cost of a simulated study grows with n). */
export function splitGrid(grid: readonly number[], parts: number): number[][] {
  const groups = Array.from({ length: Math.max(1, Math.min(parts, grid.length)) }, () => ({ ns: [] as number[], work: 0 }));
  for (const n of [...grid].sort((a, b) => b - a)) {
    const lightest = groups.reduce((a, b) => (b.work < a.work ? b : a));
    lightest.ns.push(n);
    lightest.work += n;
  }
  return groups.map((g) => g.ns.sort((a, b) => a - b));
}

function finishPlan(p: ResolvedComparisonPlan, rows: PlanRow[]): ComparisonPlanResult {
  const meets = (r: PlanRow) => r.levels.every((l) => l.powerAtHalf >= p.targetPower && l.falsePass <= p.maxFalsePass);
  const recommended = rows.find(meets) ?? null;
  return jsonClean({
    kind: 'plan-comparison' as const,
    rows,
    recommendedN: recommended?.n ?? null,
    reason: recommended ? recommendationWords(p, recommended) : noneWords(p, rows[rows.length - 1]),
    simulations: p.simulations,
    seed: p.seed,
    resamples: p.resamples,
    targetPower: p.targetPower,
    maxFalsePass: p.maxFalsePass,
    settings: p,
    warnings: planWarnings(p),
    engine: engineInfo(p.seed, p.resamples),
  });
}

const pct = (v: number) => `${Math.round(v * 1000) / 10}%`;
const short = (v: number) => Number(v.toPrecision(3)).toString();

function recommendationWords(p: ResolvedComparisonPlan, row: PlanRow): string {
  return `${row.n} specimens: the smallest n on the grid at which, at every decision level, a true bias of half the allowable bias ends "within" ` +
    `in at least ${pct(p.targetPower)} of simulated studies and a true bias equal to the allowable bias in at most ${pct(p.maxFalsePass)}.`;
}

/** Why no n on the grid will do, read from its largest n: which levels fall short, and what the range and the imprecision say. */
function noneWords(p: ResolvedComparisonPlan, last: PlanRow): string {
  const parts: string[] = [`No n on the grid meets both targets; at the largest, ${last.n}:`];
  for (const l of last.levels) {
    if (l.powerAtHalf < p.targetPower) {
      parts.push(`at ${short(l.level)} the power is ${pct(l.powerAtHalf)} (target ${pct(p.targetPower)}): the CI of the bias there is typically ±${l.medianHalfWidth === null ? '?' : short(l.medianHalfWidth)}, ` +
        `against an allowable bias of ${short(l.allowable)}.`);
    }
    if (l.falsePass > p.maxFalsePass) parts.push(`at ${short(l.level)} a bias equal to the goal still passes in ${pct(l.falsePass)} of studies (at most ${pct(p.maxFalsePass)} wanted).`);
  }
  const ratio = p.low > 0 ? p.high / p.low : null;
  const causes: string[] = [];
  if (ratio !== null && ratio < 3) causes.push(`the range is narrow (highest/lowest ${short(ratio)}; a slope is poorly fixed over a narrow range, Linnet 1999)`);
  if (p.decisionLevels.some((l) => l < p.low || l > p.high)) causes.push('a decision level lies outside the planned range (the bias there is extrapolated)');
  if (p.regression === 'ols') causes.push('least squares ignores the comparative method\'s error, so its slope is pulled towards 0 and the bias it predicts away from the centre is off (Deming or Passing–Bablok allow for that error)');
  const goal = Math.min(...last.levels.map((l) => l.allowable));
  const sd = p.errorModel === 'constant' ? Math.hypot(p.cvComparative, p.cvCandidate) : null;
  if (sd !== null && sd > goal) causes.push(`the imprecision (combined SD ${short(sd)}) is large against the allowable bias (${short(goal)})`);
  if (p.errorModel === 'proportional' && Math.hypot(p.cvComparative, p.cvCandidate) > (p.allowableBiasPercent ?? 0)) {
    causes.push(`the imprecision (combined CV ${short(Math.hypot(p.cvComparative, p.cvCandidate))}%) is large against the allowable bias`);
  }
  if (causes.length) parts.push(`Likely cause: ${causes.join('; ')}.`);
  parts.push('More specimens, a wider range, more precise methods or a reconsidered goal would help.');
  return parts.join(' ');
}

function planWarnings(p: ResolvedComparisonPlan): string[] {
  const w: string[] = [];
  const outside = p.decisionLevels.filter((l) => l < p.low || l > p.high);
  if (outside.length) w.push(`Decision ${outside.length === 1 ? 'level' : 'levels'} ${outside.map(short).join(', ')} outside the planned range ${short(p.low)} to ${short(p.high)}: the bias there is extrapolated.`);
  if (p.errorModel === 'constant' && p.low - 3 * Math.max(p.cvComparative, p.cvCandidate) < 0) {
    w.push('With a constant SD, some simulated results at the low end are negative; a method that cannot report below 0 would censor them.');
  }
  if (p.regression === 'ols') w.push('Least squares assumes the comparative method has no error; with the imprecision stated, its slope is biased towards 0 and the figures show what that costs.');
  w.push(`Each simulated study uses ${p.resamples.toLocaleString('en-US')} bootstrap resamples (a real analysis uses more); the figures carry a Monte Carlo error of up to ${pct(0.5 / Math.sqrt(p.simulations))} (one SE).`);
  return w;
}
