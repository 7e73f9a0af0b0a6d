import type { OverallVerdict } from '../../../../shared/schemas';

/** How a study's overall verdict reads in the archive: an icon, a short word and a sentence; never colour alone. */
export interface VerdictView {
  /** The verdict's key, or 'none'; the stylesheet tints by it, but the word and icon carry the meaning. */
  key: OverallVerdict | 'none';
  icon: string;
  word: string;
  sentence: string;
}

const VIEWS: Record<OverallVerdict | 'none', VerdictView> = {
  within: {
    key: 'within', icon: 'check_circle', word: 'Within goal',
    sentence: 'At every decision level the whole CI of the bias lies within the allowable bias.',
  },
  inconclusive: {
    key: 'inconclusive', icon: 'help', word: 'Inconclusive',
    sentence: 'At one or more decision levels the CI crosses the allowable bias; these data cannot settle it.',
  },
  exceeds: {
    key: 'exceeds', icon: 'cancel', word: 'Exceeds goal',
    sentence: 'At one or more decision levels the whole CI of the bias lies beyond the allowable bias.',
  },
  accepted: {
    key: 'accepted', icon: 'verified', word: 'Interval fits',
    sentence: 'Few enough local results fell outside the stated reference interval.',
  },
  failed: {
    key: 'failed', icon: 'block', word: 'Interval does not fit',
    sentence: 'Too many local results fell outside the stated reference interval.',
  },
  established: {
    key: 'established', icon: 'straighten', word: 'Interval established',
    sentence: 'A reference interval was established from the local results.',
  },
  none: {
    key: 'none', icon: 'remove_circle_outline', word: 'No verdict',
    sentence: 'There are no finished findings with a verdict (no analysis yet, or no decision levels set).',
  },
};

export function verdictView(verdict: OverallVerdict | null | undefined): VerdictView {
  return VIEWS[verdict ?? 'none'];
}

/** The verdicts a search may ask for, with their words, in the order the chooser lists them. */
export const VERDICT_CHOICES: readonly VerdictView[] = (['within', 'inconclusive', 'exceeds', 'accepted', 'failed', 'established'] as const).map(
  (v) => VIEWS[v],
);

const MEANINGS: Record<string, string> = {
  accepted: 'Accepted for patient testing',
  'not-accepted': 'Not accepted for patient testing',
  'plan-approved': 'Plan approved',
};

/** A signature's meaning in words; an unknown one is shown as it came, never hidden. */
export function meaningWords(meaning: string | null | undefined): string {
  if (!meaning) return 'Not signed';
  return MEANINGS[meaning] ?? meaning;
}
