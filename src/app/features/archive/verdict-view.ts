import { VERDICTS, type OverallVerdict } from '@shared/schemas';
import { KIND_METAS } from '@shared/kinds/kinds';
import { NO_VERDICT, type VerdictView as SharedVerdictView } from '@shared/text/verdict-words';

/** How a study's overall verdict reads in the archive (the one type of shared/text/verdict-words.ts): an icon, a word, a sentence. */
export type VerdictView = SharedVerdictView<OverallVerdict | 'none'>;

/** Each kind's verdicts (shared/kinds/<kind>/meta.ts), and "No verdict". */
const VIEWS = Object.fromEntries([
  ...KIND_METAS.flatMap((m) => m.verdicts.map((v) => [v.key, { ...v, key: v.key as OverallVerdict }] as const)),
  ['none', NO_VERDICT] as const,
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
