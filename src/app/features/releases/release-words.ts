import {
  RELEASE_STATE_LABELS, REQUIREMENT_STATUS_LABELS, STUDY_KIND_LABELS, STUDY_STATE_LABELS,
  type ComponentStudy, type DueItem, type ReleaseState, type RequirementStatus, type StudyKind,
} from '@shared/schemas';

/** A state or status as the pages show it: an icon and words, never a colour alone (the tint only repeats it). */
export interface Badge {
  icon: string;
  word: string;
}

const STATE_ICONS: Record<ReleaseState, string> = {
  open: 'pending_actions',
  released: 'verified',
  'not-released': 'block',
  'needs-review': 'report',
};

export function releaseStateBadge(state: ReleaseState): Badge {
  return { icon: STATE_ICONS[state], word: RELEASE_STATE_LABELS[state] };
}

const STATUS_ICONS: Record<RequirementStatus, string> = {
  missing: 'radio_button_unchecked',
  'in-progress': 'hourglass_top',
  met: 'check_circle',
  'not-met': 'cancel',
  waived: 'do_not_disturb_on',
};

export function requirementBadge(status: RequirementStatus): Badge {
  return { icon: STATUS_ICONS[status], word: REQUIREMENT_STATUS_LABELS[status] };
}

/** The kinds of study that meet a requirement, in words: "Method comparison or Precision verification". */
export function kindsWords(kinds: readonly StudyKind[]): string {
  const words = kinds.map((k) => STUDY_KIND_LABELS[k] ?? k);
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

export function studyStateWord(study: Pick<ComponentStudy, 'state'>): string {
  return STUDY_STATE_LABELS[study.state] ?? study.state;
}

/** Where a component study opens: its Setup while a draft, its review (findings and signature) once submitted. */
export function studyLink(study: Pick<ComponentStudy, 'id' | 'state'>): (string | number)[] {
  return study.state === 'draft' ? ['/studies', study.id, 'setup'] : ['/studies', study.id, 'review'];
}

/** "2 of 3 met". */
export function metWords(met: number, required: number): string {
  return required === 0 ? 'No requirements' : `${met} of ${required} met`;
}

const DUE_ICONS: Record<DueItem['status'], string> = {
  overdue: 'event_busy',
  'due-soon': 'event_upcoming',
  later: 'event',
  started: 'play_circle',
  done: 'event_available',
};

/** The icon of a due item by its status as of today (the words say the same). */
export function dueIcon(status: DueItem['status']): string {
  return DUE_ICONS[status] ?? 'event';
}
