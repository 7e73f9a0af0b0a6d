import { FormArray, FormControl, FormGroup } from '@angular/forms';
import { DueRule, keyFrom, Requirement, type StudyKind } from '@shared/schemas';

export { keyFrom };
import { schemaRule } from '../../../ui/schema-rule';

/** One requirement as a form holds it; `key` stays hidden (kept for an existing one, made from the label for a new one). */
export type RequirementGroup = FormGroup<{
  key: FormControl<string>;
  label: FormControl<string>;
  kinds: FormControl<StudyKind[]>;
  rule: FormControl<string>;
}>;

export type DueRuleGroup = FormGroup<{
  key: FormControl<string>;
  label: FormControl<string>;
  months: FormControl<number | null>;
  rule: FormControl<string>;
  kinds: FormControl<StudyKind[]>;
}>;

/** A requirement's fields, each checked with the API's own rule so the field says what the server would. */
export function requirementGroup(r: Partial<Requirement> = {}): RequirementGroup {
  return new FormGroup({
    key: new FormControl(r.key ?? '', { nonNullable: true }),
    label: new FormControl(r.label ?? '', { nonNullable: true, validators: [schemaRule(Requirement.shape.label)] }),
    kinds: new FormControl<StudyKind[]>([...(r.kinds ?? [])], { nonNullable: true, validators: [schemaRule(Requirement.shape.kinds)] }),
    rule: new FormControl(r.rule ?? '', { nonNullable: true, validators: [schemaRule(Requirement.shape.rule)] }),
  });
}

export function dueRuleGroup(d: Partial<DueRule> = {}): DueRuleGroup {
  return new FormGroup({
    key: new FormControl(d.key ?? '', { nonNullable: true }),
    label: new FormControl(d.label ?? '', { nonNullable: true, validators: [schemaRule(DueRule.shape.label)] }),
    months: new FormControl<number | null>(d.months ?? 12, { validators: [schemaRule(DueRule.shape.months)] }),
    rule: new FormControl(d.rule ?? '', { nonNullable: true, validators: [schemaRule(DueRule.shape.rule)] }),
    kinds: new FormControl<StudyKind[]>([...(d.kinds ?? [])], { nonNullable: true, validators: [schemaRule(DueRule.shape.kinds)] }),
  });
}

export const requirementArray = (list: readonly Requirement[] = []): FormArray<RequirementGroup> =>
  new FormArray(list.map((r) => requirementGroup(r)));

export const dueRuleArray = (list: readonly DueRule[] = []): FormArray<DueRuleGroup> =>
  new FormArray(list.map((d) => dueRuleGroup(d)));

/** The rows as the API takes them: trimmed words, and a key for every row (existing keys kept). */
export function requirementsOf(rows: FormArray<RequirementGroup>): Requirement[] {
  const values = rows.getRawValue();
  const taken = new Set(values.map((v) => v.key).filter(Boolean));
  return values.map((v) => {
    const label = v.label.trim();
    const key = v.key || keyFrom(label, taken, 'requirement');
    taken.add(key);
    return { key, label, kinds: [...v.kinds], rule: v.rule.trim() };
  });
}

export function dueRulesOf(rows: FormArray<DueRuleGroup>): DueRule[] {
  const values = rows.getRawValue();
  const taken = new Set(values.map((v) => v.key).filter(Boolean));
  return values.map((v) => {
    const label = v.label.trim();
    const key = v.key || keyFrom(label, taken, 'due');
    taken.add(key);
    return { key, label, months: v.months ?? Number.NaN, rule: v.rule.trim(), kinds: [...v.kinds] };
  });
}
