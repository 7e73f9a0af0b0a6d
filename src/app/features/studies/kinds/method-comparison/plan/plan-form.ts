import { FormControl, FormGroup, type ValidatorFn } from '@angular/forms';
import type { ZodType } from 'zod';
import { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import type { ImprecisionSuggestion } from '@shared/schemas';
import { ruleControl } from '../../../setup/setup-form-group';
import { gridText, parseGrid } from './plan-grid';

type ErrorModel = SamplePlan['errorModel'];
type Shape = SamplePlan['shape'];

/** The plan as its fields hold it: numbers possibly empty, the grid as text, the two targets in %. */
export interface PlanValues {
  errorModel: ErrorModel;
  cvComparative: number | null;
  cvCandidate: number | null;
  low: number | null;
  high: number | null;
  shape: Shape;
  earlierStudyId: number | null;
  n: string;
  simulations: number | null;
  /** In %: 80 for 0.8. */
  targetPower: number | null;
  /** In %: 5 for 0.05. */
  maxFalsePass: number | null;
}

export type PlanGroup = FormGroup<{ [K in keyof PlanValues]: FormControl<PlanValues[K]> }>;

const shape = SamplePlan.shape;
const percentOf = (v: number): number => Number((v * 100).toFixed(4));
const fractionOf = (v: number): number => Number((v / 100).toFixed(6));

/** The fields' values of a saved plan, or of a new one (the shared schema's defaults, the imprecision left empty). */
export function planValues(plan: SamplePlan | null): PlanValues {
  return {
    errorModel: plan?.errorModel ?? shape.errorModel.parse(undefined),
    cvComparative: plan?.cvComparative ?? null,
    cvCandidate: plan?.cvCandidate ?? null,
    low: plan?.low ?? null,
    high: plan?.high ?? null,
    shape: plan?.shape ?? shape.shape.parse(undefined),
    earlierStudyId: plan?.earlierStudyId ?? null,
    n: gridText(plan?.n ?? shape.n.parse(undefined)),
    simulations: plan?.simulations ?? shape.simulations.parse(undefined),
    targetPower: percentOf(plan?.targetPower ?? shape.targetPower.parse(undefined)),
    maxFalsePass: percentOf(plan?.maxFalsePass ?? shape.maxFalsePass.parse(undefined)),
  };
}

/** A target in % checked with the shared schema's rule of its fraction, so the field says what the server would. */
function percentRule(schema: ZodType): ValidatorFn {
  return (control) => {
    if (control.value === null || control.value === '') return { rule: 'Enter a number here' };
    const result = schema.safeParse(fractionOf(Number(control.value)));
    return result.success ? null : { rule: result.error.issues[0]?.message ?? 'Not valid' };
  };
}

const gridRule: ValidatorFn = (control) => {
  const parsed = parseGrid(String(control.value ?? ''));
  return parsed.error === null ? null : { rule: parsed.error };
};

/** The plan's fields, each checked with the shared SamplePlan's rule for it (the whole plan is checked again on saving). */
export function buildPlanForm(values: PlanValues): PlanGroup {
  return new FormGroup({
    errorModel: new FormControl(values.errorModel, { nonNullable: true }),
    cvComparative: ruleControl<number | null>(shape.cvComparative, values.cvComparative),
    cvCandidate: ruleControl<number | null>(shape.cvCandidate, values.cvCandidate),
    low: ruleControl<number | null>(shape.low, values.low),
    high: ruleControl<number | null>(shape.high, values.high),
    shape: new FormControl(values.shape, { nonNullable: true }),
    earlierStudyId: new FormControl(values.earlierStudyId),
    n: new FormControl(values.n, { nonNullable: true, validators: [gridRule] }),
    simulations: ruleControl<number | null>(shape.simulations, values.simulations),
    targetPower: new FormControl(values.targetPower, { validators: [percentRule(shape.targetPower)] }),
    maxFalsePass: new FormControl(values.maxFalsePass, { validators: [percentRule(shape.maxFalsePass)] }),
  });
}

/** Whether the range fields are used: an earlier study's values bring their own range. */
export const usesRange = (s: Shape): boolean => s !== 'earlier-study';

/**
 * The plan as the study's settings take it (settings.samplePlan). Empty numbers become NaN so the shared schema names
 * the field; with an earlier study's values, the range fields are not shown and keep what they held (0 when empty).
 */
export function planBody(v: PlanValues): SamplePlan {
  const grid = parseGrid(v.n);
  const range = usesRange(v.shape);
  return {
    errorModel: v.errorModel,
    cvComparative: v.cvComparative ?? Number.NaN,
    cvCandidate: v.cvCandidate ?? Number.NaN,
    low: v.low ?? (range ? Number.NaN : 0),
    high: v.high ?? (range ? Number.NaN : 0),
    shape: v.shape,
    earlierStudyId: range ? null : v.earlierStudyId,
    n: grid.values ?? [Number.NaN],
    simulations: v.simulations ?? Number.NaN,
    targetPower: v.targetPower === null ? Number.NaN : fractionOf(v.targetPower),
    maxFalsePass: v.maxFalsePass === null ? Number.NaN : fractionOf(v.maxFalsePass),
  };
}

/** True when two plans say the same (compared as the shared schema orders and fills them). */
export function samePlan(a: SamplePlan | null, b: SamplePlan | null): boolean {
  const canonical = (p: SamplePlan | null) => {
    if (p === null) return 'null';
    const parsed = SamplePlan.safeParse(p);
    return JSON.stringify(parsed.success ? parsed.data : p);
  };
  return canonical(a) === canonical(b);
}

/** The value a precision study suggests for one method under the error model: its largest CV (%) or SD (unit). */
export const suggested = (s: ImprecisionSuggestion | null, model: ErrorModel): number | null =>
  s === null ? null : model === 'proportional' ? Number(s.cv.toPrecision(3)) : Number(s.sd.toPrecision(3));
