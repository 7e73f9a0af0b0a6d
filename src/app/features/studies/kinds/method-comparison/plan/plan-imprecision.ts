import type { Study, StudyPlan } from '@shared/schemas';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import { suggested, type PlanGroup } from './plan-form';

export type Side = 'comparative' | 'candidate';
export const SIDES: readonly Side[] = ['comparative', 'candidate'];
/** The plan's field of each method's imprecision. */
export const FIELD = { comparative: 'cvComparative', candidate: 'cvCandidate' } as const;

type Found = StudyPlan['imprecision'];
type Model = SamplePlan['errorModel'];

/** What a signed precision study offers one method, in the terms of the error model. */
export interface Suggestion { side: Side; title: string; instrument: string; materials: number; value: number }

export function suggestionsOf(found: Found | undefined, model: Model): Suggestion[] {
  if (!found) return [];
  return SIDES.flatMap((side) => {
    const s = found[side];
    return s ? [{ side, title: s.title, instrument: s.instrument, materials: s.materials.length, value: suggested(s, model)! }] : [];
  });
}

/** "Candidate method (y), Chemistry line 2: CV %", "… : SD, mmol/L". */
export function imprecisionLabel(study: Pick<Study, 'comparativeInstrument' | 'candidateInstrument'> | null, side: Side, model: Model, unit: string): string {
  const instrument = side === 'comparative' ? study?.comparativeInstrument?.name : study?.candidateInstrument?.name;
  const method = side === 'comparative' ? 'Comparative method (x)' : 'Candidate method (y)';
  const what = model === 'proportional' ? 'CV %' : `SD${unit ? `, ${unit}` : ''}`;
  return `${method}${instrument ? `, ${instrument}` : ''}: ${what}`;
}

export function suggestionText(x: Suggestion, model: Model, unit: string): string {
  const what = model === 'proportional' ? `CV ${x.value}%` : `SD ${x.value}${unit ? ` ${unit}` : ''}`;
  return `From precision study “${x.title}” (${x.instrument}, signed): largest within-laboratory ${what} over ${x.materials} ${x.materials === 1 ? 'material' : 'materials'}.`;
}

/** Fills each empty imprecision field with what a signed precision study found (for a plan not yet set). */
export function fillEmpty(form: PlanGroup, found: Found): void {
  for (const side of SIDES) {
    const control = form.controls[FIELD[side]];
    const value = suggested(found[side], form.controls.errorModel.value);
    if (control.value === null && value !== null) control.setValue(value);
  }
}

/** When the error model changes, a field still holding the suggestion takes the suggestion of the new model (CV ↔ SD); a typed value stays. */
export function followModel(form: PlanGroup, found: Found | undefined, before: Model, model: Model): void {
  for (const side of SIDES) {
    const control = form.controls[FIELD[side]];
    const old = suggested(found?.[side] ?? null, before);
    if (old !== null && control.value === old) control.setValue(suggested(found![side], model));
  }
}
