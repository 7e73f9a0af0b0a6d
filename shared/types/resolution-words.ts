import type { ComparisonResolution, Resolution } from '../stats/resolution';

/**
 * What the reporting step allows, in words, for the findings pages and the PDF (DOMAIN.md, "Coarse
 * results"). Results stored before the engine reported its step have no resolution: every function
 * here then says nothing, so old findings read as they always did.
 */

const TAIL = 'the data cannot show a difference finer than the step.';
const SOURCE_WORDS: Record<Resolution['source'], string> = { analyte: "from the analyte's decimals", data: 'detected from the data' };
const DIFFERENCE_PATH = /^(bias\.|sd$|limitsOfAgreement\.)/;

const withUnit = (text: string, unit: string): string => (unit ? `${text} ${unit}` : text);

/** A step in plain figures: two significant digits at most, no trailing zeros (1, 0.1, 0.5, 0.71, 0.03, 1000). */
export function stepFigure(value: number): string {
  if (!Number.isFinite(value) || value <= 0) return '—';
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(value) + 1e-9));
  return Number(value.toFixed(decimals)).toString();
}

/** Beside an estimate: "CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step." */
export function narrowCiNote(step: string): string {
  return `CI narrower than one reporting step (${step}): ${TAIL}`;
}

/** The same in a sentence of its own, after the estimate and its CI. */
export function narrowCiSentence(step: string): string {
  return `The CI is narrower than one reporting step (${step}): ${TAIL}`;
}

/** Short, for a crowded cell (the with-and-without table): the full words stand beside the estimate elsewhere. */
export const NARROW_CI_SHORT = 'CI narrower than one reporting step';

/**
 * The step that applies to the estimate at `path`, with its unit: a difference's step for bias, SD and
 * limits of agreement (in % for percent differences), the slope's step for the slope, else the results' step.
 */
export function estimateStep(resolution: Resolution, path: string, unit: string, differenceUnit = unit): string {
  const c = resolution as Partial<ComparisonResolution>;
  if (path === 'regression.slope' && c.slopeIncrement != null) return `${stepFigure(c.slopeIncrement)} on the slope`;
  if (DIFFERENCE_PATH.test(path) && c.differenceIncrement != null) return withUnit(stepFigure(c.differenceIncrement), differenceUnit);
  return withUnit(stepFigure(resolution.increment), unit);
}

/** The words beside each estimate whose CI is narrower than its step, keyed by the estimate's path in the result. */
export function narrowCiNotes(resolution: Resolution | null | undefined, unit: string, differenceUnit = unit): Record<string, string> {
  const notes: Record<string, string> = {};
  for (const path of resolution?.limitedEstimates ?? []) notes[path] = narrowCiNote(estimateStep(resolution!, path, unit, differenceUnit));
  return notes;
}

/**
 * The rule, stated once near the top of the findings when any estimate is limited by the step; null when
 * none is. A comparison adds how its decision-level verdicts are judged, and the step of a percent
 * difference and of the slope when those estimates are among the limited.
 */
export function resolutionRule(resolution: Resolution | null | undefined, unit: string, differenceUnit = unit): string | null {
  if (!resolution?.limitedEstimates?.length) return null;
  const h = resolution.increment;
  const head = `Results are reported in steps of ${withUnit(stepFigure(h), unit)} (${SOURCE_WORDS[resolution.source] ?? 'detected from the data'}). ` +
    'A confidence interval narrower than one step says nothing finer than the step';
  const c = resolution as Partial<ComparisonResolution>;
  if (c.differenceIncrement === undefined) return `${head}.`;
  const parts = [`${head}; a decision-level verdict is judged on an interval no narrower than the estimate ± half a step (${withUnit(stepFigure(h / 2), unit)}).`];
  const limited = resolution.limitedEstimates;
  if (differenceUnit !== unit && c.differenceIncrement !== null && limited.some((p) => DIFFERENCE_PATH.test(p))) {
    parts.push(`For the percent differences one step is ${withUnit(stepFigure(c.differenceIncrement), differenceUnit)} (one step at the median pair mean).`);
  }
  if (c.slopeIncrement != null && limited.includes('regression.slope')) {
    parts.push(`On the slope one step is ${stepFigure(c.slopeIncrement)} (a change that moves the line by one step across the comparative range).`);
  }
  return parts.join(' ');
}

/** Why and on what a decision level was judged when its CI is narrower than the step; `judged` is the formatted interval. */
export function judgedOnSentence(judged: string, step: string): string {
  return `The CI is narrower than one reporting step${step ? ` (${step})` : ''}, so the verdict is judged on ${judged} (the CI widened to the estimate ± half a step)`;
}

/** Everything the findings say about the reporting step: notes beside estimates, the rule once, and an estimate's step. */
export interface StepWords {
  notes: Record<string, string>;
  rule: string | null;
  step: (path: string) => string;
}

/**
 * The step's words for one result, in the client and the PDF alike. `differenceUnit`: '%' for percent
 * differences. Results stored before the engine reported its step have no resolution and get no words.
 */
export function stepWords(resolution: Resolution | null | undefined, unit: string, differenceUnit = unit): StepWords {
  return {
    notes: narrowCiNotes(resolution, unit, differenceUnit),
    rule: resolutionRule(resolution, unit, differenceUnit),
    step: (path: string): string => (resolution ? estimateStep(resolution, path, unit, differenceUnit) : ''),
  };
}
