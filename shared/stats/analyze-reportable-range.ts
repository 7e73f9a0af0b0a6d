import { percentileInterval } from './confidence-interval';
import { CAUTION } from './comparison-types';
import { RANGE_LEVELS } from './reportable-range-types';
import { cochranC } from './cochran-c';
import { allowableBiasAt } from './decision-levels';
import { engineInfo } from './engine';
import { jsonClean } from './json-clean';
import { magnitudeProblem } from './magnitude';
import { OptionError } from './options';
import { evaluatePolynomial, fitPolynomial, polynomialDesign, solveDesign, type PolynomialFit } from './polynomial-fit';
import { narrowerThanStep, resolutionStep } from './resolution';
import { resolveRangeOptions, type ResolvedLevel, type ResolvedRangeOptions } from './reportable-range-options';
import type { RangeFit, RangeLevelResult, RangeOptions, RangeResult, RangeRow, RangeVerdict } from './reportable-range-types';
import { streamFor } from './rng';
import { mean as meanOf, sampleSd, sampleVariance } from './summation';
import { decimalPlace } from './precision';
import { givenText, rangeFormat, verdictSentence } from './reportable-range-words';
import { withUnit } from '../types/findings-numbers';

/** Cochran's test of the replicate scatter at ISO 5725-2's "outlier" level (from memory). */
const SCATTER_ALPHA = 0.01;
/** The highest degree fitted (CLSI EP06 practice: 1, 2 and 3). */
const TOP_DEGREE = 3;

interface LevelData { level: ResolvedLevel; values: number[] }

/**
 * Reportable range (CLSI EP06 practice, from memory, as stated in DOMAIN.md "Reportable range"): linearity across
 * the levels and recovery of their assigned values.
 *
 * 1. Least-squares polynomials of degree 1, 2 and 3 through every included result against its level's x
 *    (polynomial-fit.ts); a degree d is fitted only when d + 2 levels have results (a fit needs d + 1 and one more
 *    leaves a test of lack of fit), and each higher degree's top coefficient is t-tested (two-sided, at `alpha`).
 * 2. The best-fitting degree: the highest of 2 and 3 whose top coefficient differs from 0 at `alpha`; else 1
 *    ("keep a higher degree only when its top coefficient differs from 0").
 * 3. At each level: the straight line's value (linear), the best fit's (fitted), the deviation fitted − linear, in
 *    the unit and in % of |linear|; the goal there, the larger of the absolute goal and the % goal of |linear|
 *    ("as for allowable bias"); within when |deviation| ≤ goal (EP06 practice judges the point estimate).
 * 4. The deviation's percentile bootstrap CI: B resamples, each drawing every level's included results with
 *    replacement within the level (the levels' x stay fixed, so one QR factorisation serves every refit), refitting
 *    the line and the best degree (the degree chosen on the data, not re-chosen per resample). Stream
 *    `${seed}:reportable-range`; draw order: resample b, levels in order of x, each level's n draws. A level with one
 *    result contributes it unchanged. With 2 or 3 replicates a level there are few distinct resamples: the CI is
 *    coarse (warned). No CI when the straight line fits best (the deviation is then 0 by construction).
 * 5. Recovery = 100 · mean / assigned where the level has an assigned value (given, or from its fraction and the pools).
 * 6. The verified range: the longest run of consecutive levels (in order of x) that are within (ties: the lowest run);
 *    its ends as assigned values, or on the 'fraction' basis as the end levels' means. Verdict: every analysed level
 *    within, 'range-verified'; a shorter run, 'range-shortened'; none, 'range-not-verified'.
 * Warnings: fewer than 5 levels, a level with fewer results than planned or fewer than 2, Cochran's test of the
 * replicate variances (cochran-c.ts, α = 0.01), a response that is not monotone, a degree not fitted, a CI beyond the
 * goal where the deviation is within, and a claimed interval the levels or the verified range do not reach.
 *
 * Rows: a row's `position` (1-based grid row) names it in errors; without it, its 1-based index. A row naming a level
 * the settings do not list is refused; a listed level with no included results is left out, with a warning.
 * @throws OptionError naming a bad option, an unknown level (and the first row naming it), or too few levels with results
 * @throws RangeError naming the row whose value is not finite or out of range
 */
export function analyzeReportableRange(rows: RangeRow[], options: RangeOptions, onProgress?: (fraction: number) => void): RangeResult {
  const o = resolveRangeOptions(options);
  if (!Array.isArray(rows)) throw new RangeError('analyzeReportableRange requires a list of rows');
  const byName = new Map<string, LevelData>(o.levels.map((l) => [l.name.toLowerCase(), { level: l, values: [] }]));
  const ordered = new Map<LevelData, { replicate: number | null; index: number; value: number }[]>();
  let excludedCount = 0;
  rows.forEach((row, i) => {
    if (!row || typeof row !== 'object') throw new RangeError(`analyzeReportableRange: row ${i + 1} is not a result`);
    const position = typeof row.position === 'number' && Number.isFinite(row.position) ? row.position : i + 1;
    const name = typeof row.level === 'string' ? row.level.trim() : String(row.level ?? '').trim();
    const data = byName.get(name.toLowerCase());
    if (!data) throw new OptionError('levels', `do not list level "${name}", named at row ${position}; add it to the settings or correct the row`);
    if (typeof row.value !== 'number' || !Number.isFinite(row.value)) throw new RangeError(`analyzeReportableRange requires finite values (row ${position})`);
    const problem = magnitudeProblem(row.value);
    if (problem) throw new RangeError(`analyzeReportableRange: row ${position}: ${problem}`);
    if (row.excluded) { excludedCount++; return; }
    const list = ordered.get(data) ?? [];
    list.push({ replicate: typeof row.replicate === 'number' ? row.replicate : null, index: i, value: row.value });
    ordered.set(data, list);
  });
  for (const [data, list] of ordered) {
    list.sort((a, b) => (a.replicate ?? Infinity) - (b.replicate ?? Infinity) || a.index - b.index);
    data.values = list.map((x) => x.value);
  }

  const warnings: string[] = [];
  const all = [...byName.values()];
  for (const d of all) if (d.values.length === 0) warnings.push(`Level "${d.level.name}" has no included results, so it is not analysed.`);
  const levels = all.filter((d) => d.values.length > 0).sort((a, b) => a.level.x - b.level.x);
  const distinct = new Set(levels.map((d) => d.level.x)).size;
  if (distinct < 3) {
    throw new OptionError('levels', `have results at ${distinct} distinct value${distinct === 1 ? '' : 's'}: a straight line and its error need at least 3 levels (5 to 11 planned)`);
  }
  const x: number[] = [];
  const y: number[] = [];
  for (const d of levels) for (const v of d.values) { x.push(d.level.x); y.push(v); }
  if (x.length <= 2) throw new OptionError('levels', 'have too few results to fit a straight line with its error');

  // 1–2. the fits and the best degree
  const fitted: PolynomialFit[] = [];
  for (let degree = 1; degree <= TOP_DEGREE; degree++) {
    if (distinct < degree + 2 || x.length <= degree + 1) {
      warnings.push(`With results at ${distinct} levels the polynomial of degree ${degree} is not fitted (it needs ${degree + 2}).`);
      break;
    }
    fitted.push(fitPolynomial(x, y, degree));
  }
  const significant = (f: PolynomialFit) => f.degree > 1 && f.p < o.alpha;
  const best = [...fitted].reverse().find(significant) ?? fitted[0];
  const line = fitted[0];

  // 3. deviations and goals
  const step = resolutionStep([y], o.decimals);
  const results: RangeLevelResult[] = levels.map((d) => {
    const lin = evaluatePolynomial(line, d.level.x);
    const fit = evaluatePolynomial(best, d.level.x);
    const deviation = best === line ? 0 : fit - lin;
    const goal = allowableBiasAt(lin, o.goalAbsolute, o.goalPercent)!;
    const mean = meanOf(d.values);
    return {
      level: d.level.name, x: d.level.x, assigned: d.level.assigned, fraction: d.level.fraction,
      values: d.values, n: d.values.length, mean, sd: d.values.length >= 2 ? sampleSd(d.values) : null,
      fitted: fit, linear: lin, deviation,
      deviationPercent: lin !== 0 ? (100 * deviation) / Math.abs(lin) : null,
      deviationCi: null, goal,
      recoveryPercent: d.level.assigned !== null && d.level.assigned !== 0 ? (100 * mean) / d.level.assigned : null,
      within: Math.abs(deviation) <= goal * (1 + 1e-12),
      ciBeyondGoal: false,
    };
  });

  // 4. the bootstrap CI of each deviation
  if (best !== line) {
    const cis = bootstrapDeviations(levels, best.degree, o, onProgress);
    results.forEach((r, i) => {
      r.deviationCi = cis[i];
      r.ciBeyondGoal = r.within && (cis[i][0] < -r.goal || cis[i][1] > r.goal);
    });
  } else {
    onProgress?.(1);
  }

  // 6. the verified range and the verdict
  const run = longestRun(results.map((r) => r.within));
  const verifiedRange = run && {
    low: o.basis === 'assigned' ? results[run[0]].assigned! : results[run[0]].mean,
    high: o.basis === 'assigned' ? results[run[1]].assigned! : results[run[1]].mean,
    lowLevel: results[run[0]].level, highLevel: results[run[1]].level,
  };
  const verdict: RangeVerdict = !run ? 'range-not-verified' : run[0] === 0 && run[1] === results.length - 1 ? 'range-verified' : 'range-shortened';
  const coversClaim = claimCoverage(verifiedRange, o);

  addWarnings(warnings, levels, results, fitted, line, best, o);
  const limitedEstimates = results.flatMap((r, i) => (narrowerThanStep(r.deviationCi, step.increment) ? [`levels.${i}.deviationCi`] : []));
  const fits: RangeFit[] = fitted.map((f) => ({
    degree: f.degree, coefficients: f.coefficients, se: f.se, p: f.degree === 1 ? null : f.p,
    rss: f.rss, df: f.df, syx: f.syx, significant: significant(f),
  }));
  const result: RangeResult = {
    kind: 'reportable-range',
    basis: o.basis,
    levels: results,
    fits,
    bestDegree: best.degree,
    verifiedRange,
    verdict,
    verdictWords: verdictSentence({ verdict, verifiedRange, basis: o.basis, coversClaim, claimed: { low: o.claimedLow, high: o.claimedHigh }, levels: results }, rangeFormat(o.unit, o.decimals ?? decimalPlace(step.increment))),
    goal: { absolute: o.goalAbsolute, percent: o.goalPercent },
    claimed: { low: o.claimedLow, high: o.claimedHigh },
    coversClaim,
    alpha: o.alpha,
    confidenceLevel: o.confidenceLevel,
    scatterFlag: scatterFlag(levels),
    excludedCount,
    warnings,
    caution: CAUTION,
    engine: engineInfo(o.seed, best === line ? 0 : o.resamples),
    resolution: { ...step, limitedEstimates },
  };
  if (result.scatterFlag) {
    const f = result.scatterFlag;
    warnings.push(`Level "${f.level}" has the largest replicate scatter by Cochran's test (C = ${f.c.toFixed(3)} > ${f.critical.toFixed(3)} at α = ${SCATTER_ALPHA}): check its results before relying on the fit.`);
  }
  return jsonClean(result);
}

/**
 * Percentile CIs of the deviation at each level (step 4 of analyzeReportableRange). Memory: one Float64Array of B
 * per level.
 */
function bootstrapDeviations(levels: LevelData[], degree: number, o: ResolvedRangeOptions, onProgress?: (f: number) => void): [number, number][] {
  const x: number[] = [];
  for (const d of levels) for (let j = 0; j < d.values.length; j++) x.push(d.level.x);
  const lineDesign = polynomialDesign(x, 1);
  const bestDesign = polynomialDesign(x, degree);
  const stream = streamFor(o.seed, 'reportable-range');
  const B = o.resamples;
  const replicates = levels.map(() => new Float64Array(B));
  const ys = new Float64Array(x.length);
  const work = new Float64Array(x.length);
  const every = Math.max(1, Math.floor(B / 50));
  for (let b = 0; b < B; b++) {
    let k = 0;
    for (const d of levels) {
      const n = d.values.length;
      for (let j = 0; j < n; j++) ys[k++] = n === 1 ? d.values[0] : d.values[stream.nextIndex(n)];
    }
    const lineZ = solveDesign(lineDesign, ys, work);
    const bestZ = solveDesign(bestDesign, ys, work);
    for (let i = 0; i < levels.length; i++) {
      const xi = levels[i].level.x;
      replicates[i][b] = evaluatePolynomial({ centre: bestDesign.centre, scale: bestDesign.scale, zCoefficients: bestZ }, xi)
        - evaluatePolynomial({ centre: lineDesign.centre, scale: lineDesign.scale, zCoefficients: lineZ }, xi);
    }
    if (onProgress && (b + 1) % every === 0) onProgress((b + 1) / B);
  }
  onProgress?.(1);
  return replicates.map((r) => percentileInterval(r.sort(), o.confidenceLevel));
}

/** [first, last] of the longest run of true (ties: the first), or null. */
export function longestRun(flags: boolean[]): [number, number] | null {
  let best: [number, number] | null = null;
  let start = -1;
  flags.forEach((f, i) => {
    if (f && start < 0) start = i;
    if (f && (i === flags.length - 1 || !flags[i + 1])) {
      if (!best || i - start > best[1] - best[0]) best = [start, i];
      start = -1;
    }
  });
  return best;
}

function claimCoverage(range: RangeResult['verifiedRange'], o: ResolvedRangeOptions): boolean | null {
  if (!range || o.basis !== 'assigned' || (o.claimedLow === null && o.claimedHigh === null)) return null;
  return (o.claimedLow === null || range.low <= o.claimedLow) && (o.claimedHigh === null || range.high >= o.claimedHigh);
}

function scatterFlag(levels: LevelData[]): RangeResult['scatterFlag'] {
  const withReplicates = levels.filter((d) => d.values.length >= 2);
  const variances = withReplicates.map((d) => sampleVariance(d.values));
  const n = Math.min(...withReplicates.map((d) => d.values.length));
  const test = cochranC(variances, n, SCATTER_ALPHA);
  return test && test.significant ? { level: withReplicates[test.index].level.name, c: test.c, critical: test.critical } : null;
}

function addWarnings(
  warnings: string[], levels: LevelData[], results: RangeLevelResult[], fitted: PolynomialFit[], line: PolynomialFit,
  best: PolynomialFit, o: ResolvedRangeOptions,
): void {
  if (levels.length < RANGE_LEVELS.fewest) {
    warnings.push(`Only ${levels.length} levels have results; CLSI EP06 practice asks for ${RANGE_LEVELS.fewest} to ${RANGE_LEVELS.most} across the claimed interval.`);
  }
  const short = results.filter((r) => r.n < o.replicates);
  if (short.length) {
    warnings.push(`${short.length === 1 ? 'Level' : 'Levels'} ${short.map((r) => `"${r.level}" (${r.n})`).join(', ')} ${short.length === 1 ? 'has' : 'have'} fewer results than the ${o.replicates} planned.`);
  }
  const single = results.filter((r) => r.n < 2);
  if (single.length) {
    warnings.push(`${single.map((r) => `"${r.level}"`).join(', ')}: one result only, so its scatter cannot be judged and the bootstrap cannot resample it.`);
  }
  if (best !== line && Math.max(...results.map((r) => r.n)) <= 3) {
    warnings.push('With 3 or fewer results a level, resampling within levels gives few distinct resamples: the CIs of the deviations are coarse.');
  }
  const rising = line.coefficients[1] >= 0;
  const turns: string[] = [];
  for (let i = 1; i < results.length; i++) {
    if (results[i].x === results[i - 1].x) continue;
    const up = results[i].mean > results[i - 1].mean;
    const down = results[i].mean < results[i - 1].mean;
    if (rising ? !up : !down) turns.push(`"${results[i - 1].level}" to "${results[i].level}"`);
  }
  if (turns.length) {
    warnings.push(`The response is not monotone: the mean result does not ${rising ? 'rise' : 'fall'} from ${turns.join(', ')}.`);
  }
  const beyond = results.filter((r) => r.ciBeyondGoal);
  if (beyond.length) {
    warnings.push(`At ${beyond.map((r) => `"${r.level}"`).join(', ')} the deviation is within the goal but its CI reaches beyond it: these data cannot settle linearity there.`);
  }
  if (fitted.length > 1 && best === line && fitted.some((f) => f.degree > 1 && f.p < 0.1 && f.p >= o.alpha)) {
    warnings.push(`A higher-degree coefficient is close to significant (p < 0.1); the straight line is kept at α = ${o.alpha}, but curvature may be present.`);
  }
  if (o.basis === 'assigned') {
    const lowest = results[0].x;
    const highest = results[results.length - 1].x;
    if (o.claimedLow !== null && lowest > o.claimedLow) warnings.push(`The lowest level (${fmt(lowest, o)}) lies above the claimed low end (${fmt(o.claimedLow, o)}): the range below it is not tested.`);
    if (o.claimedHigh !== null && highest < o.claimedHigh) warnings.push(`The highest level (${fmt(highest, o)}) lies below the claimed high end (${fmt(o.claimedHigh, o)}): the range above it is not tested.`);
  }
}

function fmt(v: number, o: ResolvedRangeOptions): string {
  return withUnit(givenText(v, rangeFormat(o.unit, o.decimals)), o.unit);
}
