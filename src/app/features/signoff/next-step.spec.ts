import type { Role } from '@shared/schemas';
import { StepStudy, mayDecide, nextStep, submitBlock } from './next-step';

const draft: StepStudy = { state: 'draft', findings: 'current', supersededById: null, returnComment: null };
const ids = (study: StepStudy, roles: Role[], planApproved = false) => nextStep(study, roles, planApproved).actions.map((a) => a.id);

describe('nextStep', () => {
  it('lets a technologist submit a draft with current findings, and nothing else', () => {
    const step = nextStep(draft, ['technologist'], false);
    expect(step.state).toBe('Draft');
    expect(step.actions).toEqual([{ id: 'submit', label: 'Submit for sign-off', icon: 'send', blocked: null }]);
  });

  it('blocks the submission with the reason while the findings are not current', () => {
    for (const findings of ['none', 'queued', 'running', 'out-of-date', 'failed'] as const) {
      const [submit] = nextStep({ ...draft, findings }, ['technologist'], false).actions;
      expect(submit.id).toBe('submit');
      expect(submit.blocked).toBe(submitBlock(findings));
      expect(submit.blocked).toMatch(/\w/);
    }
    expect(submitBlock('none')).toContain('Run the analysis first');
    expect(submitBlock('out-of-date')).toContain('out of date');
  });

  it('offers a director both the submission and the plan approval until the plan is approved', () => {
    expect(ids(draft, ['director'])).toEqual(['submit', 'approve-plan']);
    expect(ids(draft, ['director'], true)).toEqual(['submit']);
    expect(ids(draft, ['technologist'], false)).not.toContain('approve-plan');
  });

  it('gives quality and admin nothing to do on a draft', () => {
    expect(ids(draft, ['quality'])).toEqual([]);
    expect(ids(draft, ['admin'])).toEqual([]);
    expect(nextStep(draft, ['quality'], false).note).toContain('still being prepared');
  });

  it('names a returned draft as returned', () => {
    const step = nextStep({ ...draft, returnComment: 'Add the low-range specimens' }, ['technologist'], false);
    expect(step.state).toBe('Draft, returned by the director');
    expect(step.actions.map((a) => a.id)).toEqual(['submit']);
  });

  it('sends a director to the review of a study awaiting sign-off; others are told it waits', () => {
    const awaiting: StepStudy = { ...draft, state: 'awaiting-signoff' };
    expect(ids(awaiting, ['director'])).toEqual(['open-review']);
    expect(ids(awaiting, ['technologist', 'director'])).toEqual(['open-review']);
    for (const roles of [['technologist'], ['quality']] as Role[][]) {
      const step = nextStep(awaiting, roles, false);
      expect(step.actions).toEqual([]);
      expect(step.state).toBe('Awaiting the director’s signature');
    }
  });

  it("tells a director who may not sign why, in the server's words, and still opens the review", () => {
    const why = 'You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).';
    const own: StepStudy = { ...draft, state: 'awaiting-signoff', mayISign: { allowed: false, why } };
    const step = nextStep(own, ['technologist', 'director'], false);
    expect(step.note).toBe(`${why} Read the findings on the review page; you may return the study.`);
    expect(step.actions.map((a) => a.id)).toEqual(['open-review']);
    const theirs: StepStudy = { ...own, mayISign: { allowed: true, why: 'You may sign it.' } };
    expect(nextStep(theirs, ['director'], false).note).toBe('Read the findings on the review page, then return the study or sign it.');
  });

  it('lets editors amend a signed study, but not quality, and nobody a superseded one', () => {
    const signed: StepStudy = { ...draft, state: 'signed' };
    expect(ids(signed, ['technologist'])).toEqual(['amend']);
    expect(ids(signed, ['director'])).toEqual(['amend']);
    expect(ids(signed, ['quality'])).toEqual([]);
    const superseded = nextStep({ ...signed, supersededById: 42 }, ['director'], true);
    expect(superseded.actions).toEqual([]);
    expect(superseded.note).toContain('study 42');
  });
});

describe('mayDecide', () => {
  it('is true only for a director while the study awaits sign-off', () => {
    expect(mayDecide({ state: 'awaiting-signoff' }, ['director'])).toBe(true);
    expect(mayDecide({ state: 'awaiting-signoff' }, ['technologist', 'quality'])).toBe(false);
    expect(mayDecide({ state: 'draft' }, ['director'])).toBe(false);
    expect(mayDecide({ state: 'signed' }, ['director'])).toBe(false);
  });
});
