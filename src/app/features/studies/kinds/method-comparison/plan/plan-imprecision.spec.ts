import type { ImprecisionSuggestion } from '@shared/schemas';
import { buildPlanForm, planValues } from './plan-form';
import { fillEmpty, followModel, imprecisionLabel, suggestionsOf, suggestionText } from './plan-imprecision';

const LINE_1: ImprecisionSuggestion = {
  studyId: 4, title: 'Glucose precision, line 1', instrument: 'Chemistry line 1', signedAt: '2026-10-01T09:00:00.000Z',
  materials: [{ name: 'Low', mean: 3.1, sd: 0.06, cv: 1.9 }], cv: 1.9, sd: 0.06,
};
const FOUND = { comparative: LINE_1, candidate: null };

describe('the imprecision a signed precision study suggests', () => {
  it('fills only an empty field, and the value follows the error model while it is the suggestion', () => {
    const form = buildPlanForm({ ...planValues(null), cvCandidate: 2.2 });
    fillEmpty(form, FOUND);
    expect([form.controls.cvComparative.value, form.controls.cvCandidate.value]).toEqual([1.9, 2.2]);
    form.controls.errorModel.setValue('constant');
    followModel(form, FOUND, 'proportional', 'constant');
    expect(form.controls.cvComparative.value).toBe(0.06);
    form.controls.cvComparative.setValue(0.08);
    followModel(form, FOUND, 'constant', 'proportional');
    expect(form.controls.cvComparative.value).toBe(0.08);
  });

  it('says where the value comes from, in the terms of the error model, and labels each field with its instrument', () => {
    const [s] = suggestionsOf(FOUND, 'constant');
    expect(suggestionText(s, 'constant', 'mmol/L')).toBe('From precision study “Glucose precision, line 1” (Chemistry line 1, signed): largest within-laboratory SD 0.06 mmol/L over 1 material.');
    expect(suggestionsOf(FOUND, 'proportional').map((x) => [x.side, x.value])).toEqual([['comparative', 1.9]]);
    const study = { comparativeInstrument: { id: 1, name: 'Chemistry line 1' }, candidateInstrument: null };
    expect(imprecisionLabel(study, 'comparative', 'constant', 'mmol/L')).toBe('Comparative method (x), Chemistry line 1: SD, mmol/L');
    expect(imprecisionLabel(study, 'candidate', 'proportional', 'mmol/L')).toBe('Candidate method (y): CV %');
  });
});
