import { CAUTION } from './comparison-types';
import { engineInfo } from './engine';
import { jsonClean } from './json-clean';
import { magnitudeProblem } from './magnitude';
import { oneWayAnova } from './one-way-anova';
import { OptionError } from './options';
import { coefficientOfVariation, precisionComponents, sdConfidenceInterval } from './precision-components';
import { resolvePrecisionOptions, type ResolvedMaterial, type ResolvedPrecisionOptions } from './precision-options';
import { truenessCheck } from './precision-trueness';
import type { PrecisionMaterialResult, PrecisionOptions, PrecisionResult, PrecisionRow } from './precision-types';
import { verifyPrecisionClaim } from './precision-verification';
import { flagReplicates } from './replicate-outliers';
import { resolutionStep } from './resolution';

/** The design of CLSI EP15-A3 practice has 5 days; fewer is noted (DOMAIN.md "Precision"). */
const DESIGN_DAYS = 5;
/** Fewer than 3 days: the between-day component rests on 1 or 2 df (warned; our rule). */
const FEWEST_DAYS_FOR_A_VERDICT = 3;
/** Fewer than 10 df for repeatability: the UVL factor exceeds 1.43 at ℓ = 1 (warned; our rule). */
const FEWEST_REPEATABILITY_DF = 10;

/**
 * Precision verification (CLSI EP15-A3 practice, from memory, as stated in DOMAIN.md "Precision"): for each
 * material, in the order of `options.materials`, a one-way ANOVA by day of the included results
 * (one-way-anova.ts), repeatability, between-day and within-laboratory components with their df and χ² CIs
 * (precision-components.ts), each claim judged against its upper verification limit at α over ℓ materials
 * (precision-verification.ts), trueness against an assigned value where one is given (precision-trueness.ts)
 * and replicates flagged at |x − mean of the day's other results| > outlierFactor·s_r, with s_r of the results
 * without x (replicate-outliers.ts; flags only).
 *
 * Rows: a row's `position` (1-based grid row) names it in errors and flags; without it, its 1-based index.
 * Excluded rows are never used; they are counted in `excludedCount`. A row naming a material the settings do
 * not list is refused. A listed material with no included results is not analysed, with a warning, and ℓ
 * (`materialsTested`) counts the materials analysed. Days are the rows' `day` labels, trimmed, and sort
 * naturally: all-numeric labels by value, others by text with digit runs compared as numbers (dates
 * YYYY-MM-DD sort by date, "run 2" before "run 10"). A day's values are listed by replicate number (rows
 * without one last, in input order).
 *
 * No resampling: every figure is closed-form, so `engine.resamples` is 0 and the seed is only recorded.
 * `resolution` gives the reporting step; no CI here is judged against it (`limitedEstimates` is empty).
 * @throws OptionError naming a bad option, an unknown material (and the first row naming it), or a material
 *   whose results cannot be analysed (fewer than 2 days, or no day with two results, or a CV claim at mean 0)
 * @throws RangeError naming the row whose value is not finite, out of range, or whose day is empty
 */
export function analyzePrecision(rows: PrecisionRow[], options: PrecisionOptions): PrecisionResult {
  const o = resolvePrecisionOptions(options);
  if (!Array.isArray(rows)) throw new RangeError('analyzePrecision requires a list of rows');
  const byMaterial = new Map<string, { row: PrecisionRow; position: number; day: string }[]>(o.materials.map((m) => [m.name, []]));
  const excludedBy = new Map<string, number>(o.materials.map((m) => [m.name, 0]));
  let excludedCount = 0;
  rows.forEach((row, i) => {
    if (!row || typeof row !== 'object') throw new RangeError(`analyzePrecision: row ${i + 1} is not a result`);
    const position = typeof row.position === 'number' && Number.isFinite(row.position) ? row.position : i + 1;
    const material = typeof row.material === 'string' ? row.material.trim() : '';
    const list = byMaterial.get(material);
    if (!list) {
      throw new OptionError('materials', `does not list material "${material}", named at row ${position}; add it to the settings or correct the row`);
    }
    if (typeof row.value !== 'number' || !Number.isFinite(row.value)) throw new RangeError(`analyzePrecision requires finite values (row ${position})`);
    const problem = magnitudeProblem(row.value);
    if (problem) throw new RangeError(`analyzePrecision: row ${position}: ${problem}`);
    const day = typeof row.day === 'string' ? row.day.trim() : '';
    if (day === '') throw new RangeError(`analyzePrecision: row ${position}: the day (or run) is empty`);
    if (row.excluded) {
      excludedCount++;
      excludedBy.set(material, excludedBy.get(material)! + 1);
    } else {
      list.push({ row, position, day });
    }
  });

  const warnings: string[] = [];
  const analysed = o.materials.filter((m) => {
    if (byMaterial.get(m.name)!.length > 0) return true;
    const excluded = excludedBy.get(m.name)!;
    warnings.push(excluded > 0
      ? `Material "${m.name}": all ${excluded} ${excluded === 1 ? 'result is' : 'results are'} excluded, so it is not analysed.`
      : `Material "${m.name}" has no results, so it is not analysed.`);
    return false;
  });
  if (analysed.length === 0) throw new OptionError('materials', 'have no included results to analyse');
  const materialsTested = analysed.length;

  const materials = analysed.map((m) => analyseMaterial(m, byMaterial.get(m.name)!, o, materialsTested, warnings));
  const values = analysed.flatMap((m) => byMaterial.get(m.name)!.map((r) => r.row.value));
  const result: PrecisionResult = {
    kind: 'precision',
    materials,
    alpha: o.alpha,
    materialsTested,
    excludedCount,
    warnings,
    caution: CAUTION,
    engine: engineInfo(o.seed, 0),
    resolution: { ...resolutionStep([values], o.decimals), limitedEstimates: [] },
  };
  return jsonClean(result);
}

function analyseMaterial(
  m: ResolvedMaterial, rows: { row: PrecisionRow; position: number; day: string }[],
  o: ResolvedPrecisionOptions, materialsTested: number, warnings: string[],
): PrecisionMaterialResult {
  const days = groupByDay(rows);
  const k = days.length;
  const n = rows.length;
  if (k < 2) {
    throw new OptionError('materials', `"${m.name}" has results on ${k} day only: at least 2 days (${o.days} planned) are needed to separate between-day from repeatability`);
  }
  if (n - k < 1) {
    throw new OptionError('materials', `"${m.name}" has one result on each day: repeatability needs at least one day with two or more results (${o.replicates} planned)`);
  }
  const anova = oneWayAnova(days.map((d) => d.results.map((r) => r.value)));
  const mean = anova.mean;
  if (m.claimAs === 'cv' && mean === 0) {
    throw new OptionError('materials', `"${m.name}": its claims are CVs, but its results average 0, where a CV is not defined; give the claims as SDs`);
  }
  const c = precisionComponents(anova);
  const component = (sd: number, df: number) => ({ sd, cv: coefficientOfVariation(sd, mean), df, ci: sdConfidenceInterval(sd, df, o.alpha) });
  const repeatability = component(c.repeatability.sd, c.repeatability.df);
  const withinLab = component(c.withinLab.sd, c.withinLab.df);
  const r = verifyPrecisionClaim(repeatability, m.claimRepeatability, m.claimAs, o.alpha, materialsTested);
  const wl = verifyPrecisionClaim(withinLab, m.claimWithinLab, m.claimAs, o.alpha, materialsTested);
  const byDay = days.map((d, i) => ({ day: d.day, values: d.results.map((x) => x.value), mean: anova.groupMeans[i] }));
  const step = resolutionStep([rows.map((x) => x.row.value)], o.decimals).increment;
  const outliers = flagReplicates(days, o.outlierFactor, step);

  let trueness: PrecisionMaterialResult['trueness'] = null;
  if (m.assignedValue !== null) {
    const t = truenessCheck(anova, c, m.assignedValue, m.assignedUncertainty, o.alpha, materialsTested);
    trueness = {
      assigned: m.assignedValue, uncertainty: m.assignedUncertainty, source: m.assignedSource,
      bias: t.bias, biasPercent: t.biasPercent, se: t.se, df: t.df, seDf: t.seDf, multiplier: t.multiplier,
      interval: t.interval, verdict: t.verdict,
    };
  }

  const notes = designNotes(days, anova.n0, o);
  if (k < FEWEST_DAYS_FOR_A_VERDICT) {
    warnings.push(`Material "${m.name}": results on only ${k} days; with fewer than ${FEWEST_DAYS_FOR_A_VERDICT} the between-day and within-laboratory estimates rest on ${k - 1} degree${k - 1 === 1 ? '' : 's'} of freedom and no verdict is meaningful.`);
  }
  if (anova.dfWithin < FEWEST_REPEATABILITY_DF) {
    warnings.push(`Material "${m.name}": only ${n} results on ${k} days (${o.days} × ${o.replicates} planned); repeatability has ${anova.dfWithin} degrees of freedom (fewer than ${FEWEST_REPEATABILITY_DF}), so its CI is wide and the claims are hard to reject.`);
  }
  if (m.claimWithinLab < m.claimRepeatability) {
    warnings.push(`Material "${m.name}": the within-laboratory claim (${m.claimWithinLab}) is smaller than the repeatability claim (${m.claimRepeatability}); within-laboratory precision includes repeatability, so check the claims.`);
  }
  if (outliers.length > 0) {
    const where = outliers.map((x) => (x.position !== undefined ? `row ${x.position}` : `day ${x.day}`)).join(', ');
    warnings.push(`Material "${m.name}": ${outliers.length} ${outliers.length === 1 ? 'replicate lies' : 'replicates lie'} more than ${o.outlierFactor} × s_r from the other results of ${outliers.length === 1 ? 'its' : 'their'} day (${where}); exclude only with a documented reason.`);
  }

  return {
    name: m.name,
    n,
    days: k,
    mean,
    anova: { msBetween: anova.msBetween, msWithin: anova.msWithin, dfBetween: anova.dfBetween, dfWithin: anova.dfWithin, n0: anova.n0, balanced: anova.balanced },
    byDay,
    repeatability,
    betweenDay: { sd: c.betweenDay.sd, cv: coefficientOfVariation(c.betweenDay.sd, mean) },
    withinLab,
    claims: { repeatability: m.claimRepeatability, withinLab: m.claimWithinLab, as: m.claimAs },
    uvl: { repeatability: r.uvl, withinLab: wl.uvl },
    verdicts: { repeatability: r.verdict, withinLab: wl.verdict },
    trueness,
    outliers,
    notes,
  };
}

interface Day { day: string; results: { value: number; replicate: number | null; position: number }[] }

function groupByDay(rows: { row: PrecisionRow; position: number; day: string }[]): Day[] {
  const map = new Map<string, Day>();
  for (const { row, position, day } of rows) {
    if (!map.has(day)) map.set(day, { day, results: [] });
    const replicate = typeof row.replicate === 'number' && Number.isFinite(row.replicate) ? row.replicate : null;
    map.get(day)!.results.push({ value: row.value, replicate, position });
  }
  const days = [...map.values()];
  for (const d of days) d.results.sort((a, b) => (a.replicate ?? Infinity) - (b.replicate ?? Infinity) || 0);
  const numeric = days.every((d) => /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(d.day));
  return days.sort((a, b) => (numeric ? Number(a.day) - Number(b.day) : naturalCompare(a.day, b.day)));
}

/** Text order with runs of digits compared by value ("run 2" < "run 10"); ties broken by plain text order. */
function naturalCompare(a: string, b: string): number {
  const ta = a.match(/\d+|\D+/g) ?? [];
  const tb = b.match(/\d+|\D+/g) ?? [];
  for (let i = 0; i < Math.min(ta.length, tb.length); i++) {
    const x = ta[i];
    const y = tb[i];
    if (x === y) continue;
    const dx = /^\d/.test(x);
    const dy = /^\d/.test(y);
    if (dx && dy) {
      const sx = x.replace(/^0+(?=\d)/, '');
      const sy = y.replace(/^0+(?=\d)/, '');
      if (sx.length !== sy.length) return sx.length - sy.length;
      if (sx !== sy) return sx < sy ? -1 : 1;
    } else {
      return x < y ? -1 : 1;
    }
  }
  if (ta.length !== tb.length) return ta.length - tb.length;
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Notes on the design actually run: unbalanced days, fewer days or results than planned or than 5 days. */
function designNotes(days: Day[], n0: number, o: ResolvedPrecisionOptions): string[] {
  const notes: string[] = [];
  const k = days.length;
  const sizes = days.map((d) => d.results.length);
  const n = sizes.reduce((a, b) => a + b, 0);
  if (sizes.some((s) => s !== sizes[0])) {
    const counts = new Map<number, number>();
    for (const s of sizes) counts.set(s, (counts.get(s) ?? 0) + 1);
    const usual = [...counts.entries()].sort((a, b) => b[1] - a[1] || b[0] - a[0])[0][0];
    const odd = days.filter((d) => d.results.length !== usual).map((d) => `day ${d.day} has ${d.results.length} ${d.results.length === 1 ? 'result' : 'results'}`);
    notes.push(`Unbalanced: ${odd.join(', ')}, the others ${usual}; the between-day component uses the effective results per day n0 = ${say(n0)} in place of a common count.`);
  }
  if (k < o.days || k < DESIGN_DAYS) {
    const parts = [`Results on ${k} days`];
    if (k < o.days) parts.push(`of the ${o.days} planned`);
    if (k < DESIGN_DAYS) parts.push(`fewer than the ${DESIGN_DAYS} days of the EP15-A3 design (practice), so the between-day and within-laboratory estimates are less certain`);
    notes.push(`${parts.join(', ')}.`);
  }
  const planned = o.days * o.replicates;
  if (n < planned) notes.push(`${n} results of the ${planned} planned (${o.days} days × ${o.replicates} replicates).`);
  return notes;
}

/** A number in words: 4 significant digits, no trailing zeros. */
function say(v: number): string {
  return String(Number(v.toPrecision(4)));
}
