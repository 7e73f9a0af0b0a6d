import type { FindingsStatus, Role, Study } from '@shared/schemas';

/**
 * Who may take which sign-off step, mirroring the server's rules: editors (technologist, director)
 * submit and amend; only a director approves a plan, returns or signs; quality reads only.
 */
export const EDITOR_ROLES: readonly Role[] = ['technologist', 'director'];
export const DECIDER_ROLES: readonly Role[] = ['director'];

const hasAny = (roles: readonly Role[], wanted: readonly Role[]): boolean => wanted.some((r) => roles.includes(r));
export const isEditor = (roles: readonly Role[]): boolean => hasAny(roles, EDITOR_ROLES);
export const isDecider = (roles: readonly Role[]): boolean => hasAny(roles, DECIDER_ROLES);

export type StepId = 'submit' | 'approve-plan' | 'open-review' | 'amend';

/** One button of the sign-off bar; `blocked` is the reason it cannot be used yet, in words. */
export interface StepAction {
  id: StepId;
  label: string;
  icon: string;
  blocked: string | null;
}

export interface NextStep {
  /** The state in words, e.g. "Awaiting sign-off". */
  state: string;
  icon: string;
  /** What happens next, for this user, in one sentence. */
  note: string;
  actions: StepAction[];
}

export type StepStudy = Pick<Study, 'state' | 'findings' | 'supersededById' | 'returnComment'> & Partial<Pick<Study, 'mayISign'>>;

/** Why a draft cannot be submitted yet because of its findings; null when they are current. */
export function submitBlock(findings: FindingsStatus): string | null {
  switch (findings) {
    case 'current': return null;
    case 'none': return 'Run the analysis first: a study goes for sign-off with current findings.';
    case 'queued':
    case 'running': return 'Wait for the analysis to finish.';
    case 'out-of-date': return 'The findings are out of date: run the analysis again before submitting.';
    case 'failed': return 'The last analysis failed: fix the rows or settings and run it again.';
  }
}

const action = (id: StepId, label: string, icon: string, blocked: string | null = null): StepAction => ({ id, label, icon, blocked });

function draftStep(study: StepStudy, roles: readonly Role[], planApproved: boolean): NextStep {
  const actions: StepAction[] = [];
  if (isEditor(roles)) actions.push(action('submit', 'Submit for sign-off', 'send', submitBlock(study.findings)));
  if (isDecider(roles) && !planApproved) actions.push(action('approve-plan', 'Approve plan', 'task_alt'));
  const returned = study.returnComment !== null && study.returnComment !== '';
  const note = isEditor(roles)
    ? returned ? 'Make the changes the director asks for, run the analysis again if needed, then submit it again.' : 'When the findings are current and complete, submit the study for the director’s sign-off.'
    : 'The study is still being prepared; it can change until it is submitted.';
  return { state: returned ? 'Draft, returned by the director' : 'Draft', icon: returned ? 'undo' : 'edit_note', note, actions };
}

function awaitingStep(study: StepStudy, roles: readonly Role[]): NextStep {
  if (isDecider(roles)) {
    // Whether this director may sign is the server's answer (study.mayISign), said in its words.
    const note = study.mayISign?.allowed === false
      ? `${study.mayISign.why} Read the findings on the review page; you may return the study.`
      : 'Read the findings on the review page, then return the study or sign it.';
    return { state: 'Awaiting sign-off', icon: 'hourglass_top', note, actions: [action('open-review', 'Open review', 'rate_review')] };
  }
  return { state: 'Awaiting the director’s signature', icon: 'hourglass_top', note: 'Its rows and settings do not change unless the director returns it.', actions: [] };
}

function signedStep(study: StepStudy, roles: readonly Role[]): NextStep {
  if (study.supersededById !== null) {
    return { state: 'Signed, superseded', icon: 'history_toggle_off', note: `A signed amendment, study ${study.supersededById}, replaces this study.`, actions: [] };
  }
  const actions = isEditor(roles) ? [action('amend', 'Amend', 'edit_document')] : [];
  const note = isEditor(roles) ? 'A signed study never changes; to correct it, amend it into a new draft that supersedes it.' : 'A signed study never changes.';
  return { state: 'Signed', icon: 'verified', note, actions };
}

/** The sign-off bar's state in words and the next step this user may take. */
export function nextStep(study: StepStudy, roles: readonly Role[], planApproved: boolean): NextStep {
  if (study.state === 'draft') return draftStep(study, roles, planApproved);
  if (study.state === 'awaiting-signoff') return awaitingStep(study, roles);
  return signedStep(study, roles);
}

/** The review page's two decisions: only a director, only while the study awaits sign-off. */
export function mayDecide(study: Pick<Study, 'state'>, roles: readonly Role[]): boolean {
  return study.state === 'awaiting-signoff' && isDecider(roles);
}
