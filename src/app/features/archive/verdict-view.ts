import { VERDICTS, type OverallVerdict } from '@shared/schemas';
import { KIND_METAS } from '@shared/kinds/kinds';

/** How a study's overall verdict reads in the archive: an icon, a short word and a sentence; never colour alone. */
export interface VerdictView {
  /** The verdict's key, or 'none'; the stylesheet tints by it, but the word and icon carry the meaning. */
  key: OverallVerdict | 'none';
  /** The tint of the icon (shared/kinds/kind.ts VerdictWords.tone). */
  tone: 'pass' | 'fail' | 'open' | 'record' | 'none';
  icon: string;
  word: string;
  sentence: string;
}

/** Each kind's verdicts (shared/kinds/<kind>/meta.ts), and "No verdict". */
const VIEWS = Object.fromEntries([
  ...KIND_METAS.flatMap((m) => m.verdicts.map((v) => [v.key, { ...v, key: v.key as OverallVerdict }] as const)),
  ['none', {
    key: 'none', tone: 'none', icon: 'remove_circle_outline', word: 'No verdict',
    sentence: 'There are no finished findings with a verdict (no analysis yet, or no decision levels set).',
  }] as const,
]) as Record<OverallVerdict | 'none', VerdictView>;

export function verdictView(verdict: OverallVerdict | null | undefined): VerdictView {
  return VIEWS[verdict ?? 'none'];
}

/** The verdicts a search may ask for, with their words, in the order the chooser lists them. */
export const VERDICT_CHOICES: readonly VerdictView[] = VERDICTS.map((v) => VIEWS[v]);

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
