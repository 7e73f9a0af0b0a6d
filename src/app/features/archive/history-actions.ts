/** One choice of the history's "what happened" filter: an action prefix the API matches, in words. */
export interface ActionChoice {
  prefix: string;
  label: string;
  icon: string;
}

/** In the order the chooser lists them; the API matches each as a prefix of the recorded action. */
export const ACTION_CHOICES: readonly ActionChoice[] = [
  { prefix: 'sign-in', label: 'Sign-ins, refused ones too', icon: 'login' },
  { prefix: 'sign-out', label: 'Sign-outs', icon: 'logout' },
  { prefix: 'study.', label: 'Study steps: created, changed, submitted, returned, signed, amended', icon: 'description' },
  { prefix: 'study.signed', label: 'Signatures given', icon: 'draw' },
  { prefix: 'plan.', label: 'Plan approvals', icon: 'task_alt' },
  { prefix: 'specimens.', label: 'Specimen rows saved or imported', icon: 'table_rows' },
  { prefix: 'upload.', label: 'Files uploaded', icon: 'upload_file' },
  { prefix: 'analysis.', label: 'Analyses queued, finished or failed', icon: 'functions' },
  { prefix: 'signature.refused', label: 'Signatures refused: wrong password or account locked', icon: 'gpp_bad' },
  { prefix: 'signature.', label: 'Signatures refused, and self-signing in a one-person laboratory', icon: 'person_pin' },
  { prefix: 'integrity.', label: 'Integrity re-checks', icon: 'fact_check' },
  { prefix: 'reproduce.', label: 'Reproducibility re-checks', icon: 'replay' },
  { prefix: 'user.', label: 'Users: invited, changed, locked', icon: 'group' },
  { prefix: 'password.', label: 'Passwords changed or set', icon: 'key' },
  { prefix: 'password-reset.', label: 'Password links asked for or sent', icon: 'lock_reset' },
  { prefix: 'analyte.', label: 'Analyte catalog', icon: 'science' },
  { prefix: 'instrument.', label: 'Instruments', icon: 'precision_manufacturing' },
  { prefix: 'laboratory.', label: 'Laboratory settings', icon: 'tune' },
  { prefix: 'release.', label: 'Releases: created, studies linked, waived, signed, needing review', icon: 'rocket_launch' },
  { prefix: 'release.signed', label: 'Release signatures', icon: 'verified' },
  { prefix: 'release-template.', label: 'Release templates', icon: 'checklist' },
  { prefix: 'due.', label: 'Re-verification due: set, moved, started, done, reminded', icon: 'event_repeat' },
];

/** The icon of a recorded action: the most specific choice whose prefix it starts with. */
export function actionIcon(action: string): string {
  let best: ActionChoice | undefined;
  for (const choice of ACTION_CHOICES) {
    if (action.startsWith(choice.prefix) && (!best || choice.prefix.length > best.prefix.length)) best = choice;
  }
  return best?.icon ?? 'circle';
}
