import type { PrecisionMaterialResult, PrecisionResult, PrecisionVerdict } from '../../stats/precision-types';
import { findingsDecimals, formatCi, formatNumber, levelLabel, NOT_AVAILABLE, withUnit } from '../../types/findings-numbers';
import { plural } from '../../types/plural';

/**
 * The findings of a precision verification in words and table cells, one way for the Findings panel
 * (src/app/features/studies/kinds/precision/findings), the PDF and the workbook's Results sheet
 * (server/kinds/precision): from the engine's result (shared/stats/precision-types.ts) and the study's unit and
 * decimals. A claim and its upper verification limit (UVL) are in the claim's terms, an SD in the unit or a CV
 * in %, and each estimate is judged in those terms. Verdicts: 'verified' (estimate ≤ claim), 'consistent'
 * (claim < estimate ≤ UVL: consistent with the claim), 'not-verified' (estimate > UVL).
 * Numbers follow the one rule of shared/types/findings-numbers.ts; a percentage is written as the other kinds
 * write it there, "3.4%" (levelLabel, the regression's and the decision level's percentages).
 */

export type ClaimedComponent = 'repeatability' | 'withinLab';
export type PrecisionTerms = 'sd' | 'cv';

/**
 * How precision findings write their numbers: results as reported in the study's decimals; means, SDs, bias and
 * their limits one decimal more; CVs and percentages with one; degrees of freedom whole, or with one decimal when
 * fractional (Satterthwaite).
 */
export interface PrecisionFormat {
  unit: string;
  /** Decimals of a result as reported (and the least of a given value: an assigned value, its uncertainty). */
  value: number;
  /** Decimals of an estimate in the unit: a mean, an SD, a bias. */
  stat: number;
  /** Decimals of a CV or a percentage. */
  percent: number;
}

/** The format of a study with this unit and these result decimals (the study's, 1 when unset). */
export function precisionFormat(unit: string | null | undefined, decimals: number | null | undefined): PrecisionFormat {
  const d = findingsDecimals(decimals);
  return { unit: unit ?? '', value: d.value, stat: d.stat, percent: d.percent };
}

export const COMPONENT_NAMES: Record<ClaimedComponent | 'betweenDay', string> = {
  repeatability: 'Repeatability',
  betweenDay: 'Between-day',
  withinLab: 'Within-laboratory precision',
};

/** A verdict as a table cell says it. */
export const VERDICT_WORDS: Record<PrecisionVerdict, string> = {
  verified: 'Verified',
  consistent: 'Consistent with the claim',
  'not-verified': 'Not verified',
};

/** The verdict cell of a component that has no claim of its own (between-day). */
export const NO_CLAIM = 'No claim';

/** A verdict as a table cell says it; "—" when there is none. */
export function verdictWord(verdict: PrecisionVerdict | null | undefined): string {
  return verdict ? VERDICT_WORDS[verdict] : NOT_AVAILABLE;
}

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** α as given: 0.05, 0.1, 0.0125; "—" when there is none. */
export function alphaText(alpha: number | null | undefined): string {
  return finite(alpha) ? String(Number(alpha.toPrecision(6))) : NOT_AVAILABLE;
}

/** α and ℓ, the number of materials the UVL is adjusted for: "α = 0.05, 2 materials". */
export function alphaWords(r: Pick<PrecisionResult, 'alpha' | 'materialsTested'>): string {
  return `α = ${alphaText(r.alpha)}, ${plural(r.materialsTested ?? 1, 'material')}`;
}

/** A number already written, as a percentage: "3.4%" ("—" stays "—"). */
function asPercent(text: string): string {
  return text === NOT_AVAILABLE ? text : `${text}%`;
}

/** A result as reported: "5.40 mmol/L". */
export function resultText(v: number | null | undefined, f: PrecisionFormat): string {
  return withUnit(formatNumber(v, f.value), f.unit);
}

/** An estimate in the unit: "5.443 mmol/L". */
export function statText(v: number | null | undefined, f: PrecisionFormat): string {
  return withUnit(formatNumber(v, f.stat), f.unit);
}

/** A CV or a percentage: "3.4%". */
export function percentText(v: number | null | undefined, f: PrecisionFormat): string {
  return asPercent(formatNumber(v, f.percent));
}

/** A number in a claim's terms with `decimals`: an SD with its unit ("0.060 mmol/L"), or a CV in % ("3.0%"). */
export function termsText(v: number | null | undefined, as: PrecisionTerms, decimals: number, f: PrecisionFormat): string {
  const text = formatNumber(v, decimals);
  return as === 'sd' ? withUnit(text, f.unit) : asPercent(text);
}

/** The usual decimals of a number in a claim's terms: an SD's (`stat`), or a CV's (`percent`). */
export function termsDecimals(as: PrecisionTerms, f: PrecisionFormat): number {
  return as === 'sd' ? f.stat : f.percent;
}

/** The decimals of a number as typed, read from its shortest round-trip form: 0.075 → 3, 2.25 → 2, 140 → 0, 1e-7 → 7. */
export function typedDecimals(v: number): number {
  if (!Number.isFinite(v)) return 0;
  const [mantissa, exponent] = String(Math.abs(v)).split('e');
  const dot = mantissa.indexOf('.');
  return Math.max(0, (dot < 0 ? 0 : mantissa.length - dot - 1) - Number(exponent ?? 0));
}

/** A given number (a claim, an assigned value, its uncertainty) keeps its typed decimals: never fewer than `base`, at most 4 more. */
export function givenDecimals(v: number | null | undefined, base: number): number {
  return finite(v) ? Math.max(base, Math.min(typedDecimals(v), base + 4)) : base;
}

/** A given value in the unit (an assigned value, its uncertainty) as typed, with at least the results' decimals. */
export function givenText(v: number | null | undefined, f: PrecisionFormat): string {
  return withUnit(formatNumber(v, givenDecimals(v, f.value)), f.unit);
}

/** A claim as given, without unit (a table's heading says its terms): "0.040", "1.05". */
export function claimText(v: number | null | undefined, as: PrecisionTerms, f: PrecisionFormat): string {
  return formatNumber(v, givenDecimals(v, termsDecimals(as, f)));
}

/** The terms a material's claims are given in (SD when the stored result does not say). */
export function termsOf(m: Pick<PrecisionMaterialResult, 'claims'>): PrecisionTerms {
  return m.claims?.as === 'cv' ? 'cv' : 'sd';
}

/** The estimate of a claimed component in the claim's terms: its SD when the claim is an SD, its CV when a CV. */
export function estimateInTerms(m: PrecisionMaterialResult, c: ClaimedComponent): number | null {
  return (termsOf(m) === 'sd' ? m[c]?.sd : m[c]?.cv) ?? null;
}

/**
 * The decimals of a claimed component's estimate, claim and UVL in the claim's terms: an SD one decimal more
 * than the results, a CV one; a claim typed with more decimals keeps them; and one or two more where two
 * different numbers would print alike ("0.060 exceeds 0.060").
 */
export function judgedDecimals(m: PrecisionMaterialResult, c: ClaimedComponent, f: PrecisionFormat): number {
  const base = termsDecimals(termsOf(m), f);
  const estimate = estimateInTerms(m, c);
  const limits = [m.claims?.[c], m.uvl?.[c]];
  let d = givenDecimals(m.claims?.[c], base);
  const clash = (): boolean =>
    finite(estimate) && limits.some((l) => finite(l) && l !== estimate && formatNumber(l, d) === formatNumber(estimate, d));
  while (clash() && d < base + 2) d++;
  return d;
}

/** The decimals degrees of freedom are written with: 0 when whole (or from 100 on), 1 when fractional (Satterthwaite). */
export function dfDecimals(df: number | null | undefined): 0 | 1 {
  return !finite(df) || Math.abs(df - Math.round(df)) < 1e-9 || df >= 100 ? 0 : 1;
}

/** Degrees of freedom: "20", or "7.3" when fractional (Satterthwaite), whole from 100 on; "—" when there are none. */
export function dfText(df: number | null | undefined): string {
  if (!finite(df)) return NOT_AVAILABLE;
  return dfDecimals(df) === 0 ? String(Math.round(df)) : formatNumber(df, 1);
}

/**
 * The verdict on one claim in a sentence:
 * "Repeatability verified: SD 0.052 mmol/L is within the claim 0.060 mmol/L.";
 * "Within-laboratory precision consistent with the claim: CV 3.4% exceeds the claim 3.0% but not the upper
 * verification limit 3.6% (α = 0.05, 2 materials).";
 * "… not verified: CV 4.1% exceeds the upper verification limit 3.6% of the claim 3.0% (α = 0.05, 2 materials)."
 */
export function claimVerdictSentence(
  m: PrecisionMaterialResult, c: ClaimedComponent, r: Pick<PrecisionResult, 'alpha' | 'materialsTested'>, f: PrecisionFormat,
): string {
  const as = termsOf(m);
  const name = COMPONENT_NAMES[c];
  const what = as === 'sd' ? 'SD' : 'CV';
  const d = judgedDecimals(m, c, f);
  const estimate = termsText(estimateInTerms(m, c), as, d, f);
  const claim = termsText(m.claims?.[c], as, d, f);
  const uvl = termsText(m.uvl?.[c], as, d, f);
  switch (m.verdicts?.[c]) {
    case 'verified':
      return `${name} verified: ${what} ${estimate} is within the claim ${claim}.`;
    case 'consistent':
      return `${name} consistent with the claim: ${what} ${estimate} exceeds the claim ${claim} but not the upper verification limit ${uvl} (${alphaWords(r)}).`;
    case 'not-verified':
      return `${name} not verified: ${what} ${estimate} exceeds the upper verification limit ${uvl} of the claim ${claim} (${alphaWords(r)}).`;
    default:
      // Stored results without a verdict (never written by the engine) still read as a sentence.
      return `${name}: no verdict (${what} ${estimate}; claim ${claim}).`;
  }
}

/** A bias with its percentage where the assigned value is not 0: "−0.150 mmol/L, −1.3%" (`join` between them). */
function biasText(t: NonNullable<PrecisionMaterialResult['trueness']>, f: PrecisionFormat, join: string, open = '', close = ''): string {
  const percent = finite(t.biasPercent) ? `${join}${open}${percentText(t.biasPercent, f)}${close}` : '';
  return `${statText(t.bias, f)}${percent}`;
}

/**
 * The trueness verdict where an assigned value is given: whether the grand mean lies in the verification
 * interval around the assigned value (TV ± t·√(SE² + u²), DOMAIN.md "Precision"), with the bias; null without one:
 * "Trueness verified: the mean 11.850 mmol/L lies within the verification interval 11.620 to 12.380 mmol/L around
 * the assigned value 12.00 mmol/L (bias −0.150 mmol/L, −1.3%)."
 */
export function truenessSentence(m: PrecisionMaterialResult, f: PrecisionFormat): string | null {
  const t = m.trueness;
  if (!t) return null;
  const interval = withUnit(formatCi([t.interval.lower, t.interval.upper], f.stat), f.unit);
  const where = t.verdict === 'verified' ? 'within' : 'outside';
  const head = t.verdict === 'verified' ? 'Trueness verified' : 'Trueness not verified';
  return `${head}: the mean ${statText(m.mean, f)} lies ${where} the verification interval ${interval} around the assigned value ${givenText(t.assigned, f)} (bias ${biasText(t, f, ', ')}).`;
}

/** One verdict of a material in words: its repeatability, its within-laboratory precision, its trueness. */
export interface VerdictLine {
  key: ClaimedComponent | 'trueness';
  verdict: PrecisionVerdict | null;
  text: string;
}

/** A material's verdicts in sentences, in order: repeatability, within-laboratory precision, trueness where a value is assigned. */
export function verdictLines(m: PrecisionMaterialResult, r: Pick<PrecisionResult, 'alpha' | 'materialsTested'>, f: PrecisionFormat): VerdictLine[] {
  const lines: VerdictLine[] = (['repeatability', 'withinLab'] as const).map((c) => ({
    key: c, verdict: m.verdicts?.[c] ?? null, text: claimVerdictSentence(m, c, r, f),
  }));
  const trueness = truenessSentence(m, f);
  if (trueness && m.trueness) lines.push({ key: 'trueness', verdict: m.trueness.verdict, text: trueness });
  return lines;
}

/** Counts of the claims' verdicts over all materials. */
function tally(materials: PrecisionMaterialResult[]): Record<PrecisionVerdict, number> {
  const counts: Record<PrecisionVerdict, number> = { verified: 0, consistent: 0, 'not-verified': 0 };
  for (const m of materials) for (const c of ['repeatability', 'withinLab'] as const) {
    const v = m.verdicts?.[c];
    if (v) counts[v]++;
  }
  return counts;
}

/**
 * The conclusion over every material, first on the panel and in the PDF: "Every claim verified: repeatability
 * and within-laboratory precision of 2 materials." or "4 claims over 2 materials: 3 verified, 1 consistent with
 * the claim, 0 not verified.", then the trueness count where assigned values are given.
 */
export function overallSentence(r: Pick<PrecisionResult, 'materials'>): string {
  const materials = r.materials ?? [];
  if (materials.length === 0) return 'No material could be analysed; see the warnings.';
  const counts = tally(materials);
  const claims = materials.length * 2;
  const many = plural(materials.length, 'material');
  const head = counts.verified === claims
    ? `Every claim verified: repeatability and within-laboratory precision of ${many}.`
    : `${claims} claims over ${many}: ${counts.verified} verified, ${counts.consistent} consistent with the claim, ${counts['not-verified']} not verified.`;
  const assigned = materials.filter((m) => m.trueness);
  if (assigned.length === 0) return head;
  const trueness = assigned.filter((m) => m.trueness!.verdict === 'verified').length;
  return `${head} Trueness verified for ${trueness} of ${plural(assigned.length, 'material')} with an assigned value.`;
}

/** Whether any claim or trueness is not verified (the conclusion's style). */
export function anyNotVerified(r: Pick<PrecisionResult, 'materials'>): boolean {
  return (r.materials ?? []).some((m) =>
    m.verdicts?.repeatability === 'not-verified' || m.verdicts?.withinLab === 'not-verified' || m.trueness?.verdict === 'not-verified');
}

/** Under a material's heading: "25 results over 5 days; grand mean 5.430 mmol/L." */
export function materialSummary(m: PrecisionMaterialResult, f: PrecisionFormat): string {
  return `${plural(m.n ?? 0, 'result')} over ${plural(m.days ?? 0, 'day')}; grand mean ${statText(m.mean, f)}.`;
}

/** One row of a material's table of components; numbers as text, claim and UVL in the claim's terms without unit (the heading says it). */
export interface ComponentRow {
  key: ClaimedComponent | 'betweenDay';
  name: string;
  sd: string;
  cv: string;
  df: string;
  ci: string;
  claim: string;
  uvl: string;
  verdict: string;
  /** The verdict for the row's style; null for between-day, which has no claim of its own. */
  verdictKey: PrecisionVerdict | null;
}

/**
 * The table of the three components. The estimate in the claim's terms, its claim and its UVL share the
 * decimals of the verdict's sentence (judgedDecimals), and an SD's CI those of its SD.
 */
export function componentRows(m: PrecisionMaterialResult, f: PrecisionFormat): ComponentRow[] {
  const as = termsOf(m);
  const claimed = (key: ClaimedComponent): ComponentRow => {
    const c = m[key];
    const d = judgedDecimals(m, key, f);
    const sdDecimals = as === 'sd' ? d : f.stat;
    return {
      key, name: COMPONENT_NAMES[key], sd: formatNumber(c?.sd, sdDecimals), cv: formatNumber(c?.cv, as === 'cv' ? d : f.percent),
      df: dfText(c?.df), ci: c?.ci ? formatCi([c.ci.lower, c.ci.upper], sdDecimals) : NOT_AVAILABLE,
      claim: formatNumber(m.claims?.[key], d), uvl: formatNumber(m.uvl?.[key], d),
      verdict: verdictWord(m.verdicts?.[key]), verdictKey: m.verdicts?.[key] ?? null,
    };
  };
  return [
    claimed('repeatability'),
    {
      key: 'betweenDay', name: COMPONENT_NAMES.betweenDay, sd: formatNumber(m.betweenDay?.sd, f.stat), cv: formatNumber(m.betweenDay?.cv, f.percent),
      df: NOT_AVAILABLE, ci: NOT_AVAILABLE, claim: NOT_AVAILABLE, uvl: NOT_AVAILABLE, verdict: NO_CLAIM, verdictKey: null,
    },
    claimed('withinLab'),
  ];
}

/** The headings of the table's columns that carry a unit or the claim's terms; `uvlShort` for a narrow column (the terms note names it). */
export function componentHeadings(m: Pick<PrecisionMaterialResult, 'claims'>, f: PrecisionFormat, alpha: number | null | undefined): {
  sd: string; cv: string; ci: string; claim: string; uvl: string; uvlShort: string;
} {
  const terms = termsOf(m) === 'sd' ? (f.unit ? `SD, ${f.unit}` : 'SD') : 'CV, %';
  return {
    sd: f.unit ? `SD (${f.unit})` : 'SD',
    cv: 'CV (%)',
    ci: `${levelLabel(finite(alpha) ? 1 - alpha : 0.95)} CI of the SD${f.unit ? ` (${f.unit})` : ''}`,
    claim: `Claim (${terms})`,
    uvl: `Upper verification limit (${terms})`,
    uvlShort: `UVL (${terms})`,
  };
}

/**
 * Under a material's table: what the claim's terms are and what each verdict means; and, where the days
 * differ less than the replicates within them, that the between-day SD is set to 0.
 */
export function termsNote(m: Pick<PrecisionMaterialResult, 'claims' | 'anova'>, f: PrecisionFormat): string {
  const as = termsOf(m);
  const terms = as === 'sd' ? `SDs${f.unit ? ` in ${f.unit}` : ''}` : 'CVs in %';
  const a = m.anova;
  const clipped = a && !(a.msBetween > a.msWithin)
    ? ' The days differ less than the replicates within them (mean square between days not above that within), so the between-day SD is set to 0 and the within-laboratory SD equals the repeatability SD.'
    : '';
  return `The claims are ${terms}, so each estimate is judged as ${as === 'sd' ? 'an SD' : 'a CV'}. ` +
    'Verified: within the claim. Consistent with the claim: above the claim but within its upper verification limit (UVL), ' +
    'the most a laboratory whose true precision equals the claim would see by chance. Not verified: above that limit. ' +
    `Between-day precision has no claim of its own: it is part of the within-laboratory precision.${clipped}`;
}

/** The trueness details as label–value pairs, or none without an assigned value. */
export function truenessRows(m: PrecisionMaterialResult, f: PrecisionFormat, r: Pick<PrecisionResult, 'alpha' | 'materialsTested'>): [string, string][] {
  const t = m.trueness;
  if (!t) return [];
  return [
    ['Assigned value', givenText(t.assigned, f)],
    ['Standard uncertainty of the assigned value', givenText(t.uncertainty, f)],
    ['Source of the assigned value', t.source?.trim() || NOT_AVAILABLE],
    ['Grand mean of the results', statText(m.mean, f)],
    ['Bias (mean − assigned value)', biasText(t, f, ' ', '(', ')')],
    ['Standard error of the grand mean', t.seDf === undefined ? statText(t.se, f) : `${statText(t.se, f)} (${dfText(t.seDf)} df)`],
    ['Degrees of freedom of the interval', dfText(t.df)],
    ...(t.multiplier === undefined ? [] : [['Multiplier t of √(SE² + u²)', formatNumber(t.multiplier, 3)] as [string, string]]),
    [`Verification interval, assigned value ± t·√(SE² + u²) (${alphaWords(r)})`, withUnit(formatCi([t.interval.lower, t.interval.upper], f.stat), f.unit)],
  ];
}

/** A flagged replicate as a table row; the result as reported, without unit (flaggedHeading says it). */
export interface FlaggedRow {
  row: string;
  day: string;
  replicate: string;
  value: string;
  why: string;
}

/** The heading of the flagged replicates' result column: "Result (mmol/L)". */
export function resultHeading(f: PrecisionFormat): string {
  return f.unit ? `Result (${f.unit})` : 'Result';
}

export function flaggedRows(m: Pick<PrecisionMaterialResult, 'outliers'>, f: PrecisionFormat): FlaggedRow[] {
  return (m.outliers ?? []).map((o) => ({
    row: o.position === undefined ? NOT_AVAILABLE : String(o.position), day: o.day,
    replicate: o.replicate === null ? NOT_AVAILABLE : String(o.replicate), value: formatNumber(o.value, f.value), why: o.why,
  }));
}

/** How α is shared among ℓ > 1 materials: "shared among 2 materials (α/ℓ = 0.025 for each upper verification limit)"; null for one. */
export function alphaSharing(r: Pick<PrecisionResult, 'alpha' | 'materialsTested'>): string | null {
  const l = r.materialsTested ?? 1;
  return l > 1 && finite(r.alpha) ? `shared among ${l} materials (α/ℓ = ${alphaText(r.alpha / l)} for each upper verification limit)` : null;
}

/** The design as label–value pairs: materials, results, days, exclusions, α and the CI level, the engine. */
export function designRows(r: PrecisionResult): [string, string][] {
  const materials = r.materials ?? [];
  const per = (value: (m: PrecisionMaterialResult) => number | string): string => materials.map((m) => `${m.name}: ${value(m)}`).join('; ');
  const total = materials.reduce((s, m) => s + (m.n ?? 0), 0);
  const sharing = alphaSharing(r);
  return [
    ['Materials tested (ℓ)', String(r.materialsTested ?? materials.length)],
    ['Results analysed (N)', materials.length > 1 ? `${total} (${per((m) => m.n)})` : String(total)],
    ['Days with results', per((m) => m.days) || NOT_AVAILABLE],
    ['Excluded with a reason', String(r.excludedCount ?? 0)],
    ['Significance level α', sharing ? `${alphaText(r.alpha)}, ${sharing}` : alphaText(r.alpha)],
    ['CIs of the SDs', `${levelLabel(finite(r.alpha) ? 1 - r.alpha : 0.95)}, two-sided, from the χ² distribution`],
    ['Engine version', r.engine?.version ?? NOT_AVAILABLE],
  ];
}
