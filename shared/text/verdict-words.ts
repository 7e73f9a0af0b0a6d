import type { Verdict } from '../stats/decision-levels';

/**
 * How verdicts read, in one place for the screen, the PDF, the workbook and the server: the verdict at a
 * decision level ('within' / 'inconclusive' / 'exceeds', shared/stats/decision-levels.ts) in each of its forms,
 * and the one type a study's overall verdict is shown with (a kind's verdicts in shared/kinds/<kind>/meta.ts,
 * the archive's badges, "No verdict").
 */

/** A verdict at a decision level: the whole CI of the predicted bias within, across or beyond the allowable bias. */
export type LevelVerdict = Verdict;

/** The overall verdict's tint: a pass, a failure, an open question, a plain record, or none reached. */
export type VerdictTone = 'pass' | 'fail' | 'open' | 'record' | 'none';

/** How a study's overall verdict reads: an icon, a short word and a sentence; never colour alone. */
export interface VerdictView<K extends string = string> {
  /** The verdict's key ('none' for no verdict); the stylesheet tints by it, but the word and icon carry the meaning. */
  key: K;
  tone: VerdictTone;
  icon: string;
  word: string;
  sentence: string;
}

/** The view of a study without a verdict. */
export const NO_VERDICT: VerdictView<'none'> = {
  key: 'none', tone: 'none', icon: 'remove_circle_outline', word: 'No verdict',
  sentence: 'There are no finished findings with a verdict (no analysis yet, or no decision levels set).',
};

/** Each form of a decision level's verdict. */
interface LevelVerdictWords {
  /** The short word of the picture, the findings and the PDF: "Within". */
  word: string;
  /** A table cell or a line of its own: "Within the allowable bias". */
  line: string;
  /** Inside a line, after an estimate and a colon: "within the allowable bias". */
  inLine: string;
  /** The key of the picture's legend: "within". */
  legend: string;
  /** Why, when judged on the CI: "the whole CI lies inside the allowable band". */
  ci: string;
  /** Why, when judged on the CI widened to half a reporting step: "the whole interval judged on lies inside the allowable band". */
  floor: string;
  /** What the verdict means, for the PDF's note under the findings. */
  definition: string;
  /**
   * The end of a level's sentence: what the CI (`of` 'ci') or the interval judged on ('judged') does against the
   * allowable `limit` ("±0.30 mmol/L"): "the whole CI lies within the allowable ±0.30 mmol/L".
   */
  against: (of: 'ci' | 'judged', limit: string) => string;
  /** A study whose every level reached this verdict, as the study's overall verdict. */
  study: VerdictView<Verdict>;
}

export const LEVEL_VERDICT_WORDS: Record<Verdict, LevelVerdictWords> = {
  within: {
    word: 'Within', line: 'Within the allowable bias', inLine: 'within the allowable bias', legend: 'within',
    ci: 'the whole CI lies inside the allowable band', floor: 'the whole interval judged on lies inside the allowable band',
    definition: 'Within: the whole CI lies inside ±allowable.',
    against: (of, limit) => `${of === 'ci' ? 'the whole CI' : 'that whole interval'} lies within the allowable ${limit}`,
    study: { key: 'within', tone: 'pass', icon: 'check_circle', word: 'Within goal', sentence: 'At every decision level the whole CI of the bias lies within the allowable bias.' },
  },
  inconclusive: {
    word: 'Inconclusive', line: 'Inconclusive: the CI crosses the allowable bias', inLine: 'inconclusive, the CI crosses the allowable bias', legend: 'inconclusive',
    ci: 'the CI crosses an edge of the allowable band', floor: 'the interval judged on crosses an edge of the allowable band',
    definition: 'Inconclusive: the CI crosses a limit, so the data can neither show agreement nor its absence.',
    against: (of, limit) => `${of === 'ci' ? 'the CI' : 'that interval'} crosses the allowable ${limit}, so these data cannot settle it`,
    study: { key: 'inconclusive', tone: 'open', icon: 'help', word: 'Inconclusive', sentence: 'At one or more decision levels the CI crosses the allowable bias; these data cannot settle it.' },
  },
  exceeds: {
    word: 'Exceeds', line: 'Exceeds the allowable bias', inLine: 'exceeds the allowable bias', legend: 'exceeds',
    ci: 'the whole CI lies beyond the allowable band', floor: 'the whole interval judged on lies beyond the allowable band',
    definition: 'Exceeds: the whole CI lies outside it.',
    against: (of, limit) => `${of === 'ci' ? 'the whole CI' : 'that whole interval'} lies beyond the allowable ${limit}`,
    study: { key: 'exceeds', tone: 'fail', icon: 'cancel', word: 'Exceeds goal', sentence: 'At one or more decision levels the whole CI of the bias lies beyond the allowable bias.' },
  },
};

const LEVEL_VERDICTS = ['within', 'inconclusive', 'exceeds'] as const satisfies readonly Verdict[];

const each = <T>(pick: (w: LevelVerdictWords) => T): Record<Verdict, T> =>
  Object.fromEntries(LEVEL_VERDICTS.map((v) => [v, pick(LEVEL_VERDICT_WORDS[v])])) as Record<Verdict, T>;

/** A decision level's verdict in words (a table cell, a workbook cell, a key figure). */
export const VERDICT_WORDS: Record<Verdict, string> = each((w) => w.line);

/** The verdict inside a line, after an estimate and a colon. */
export const VERDICT_IN_LINE: Record<Verdict, string> = each((w) => w.inLine);

/** The verdict words of the picture, the findings and the PDF: "Within", "Inconclusive", "Exceeds", "No verdict". */
export function verdictWord(verdict: Verdict | null | undefined): string {
  return verdict ? LEVEL_VERDICT_WORDS[verdict].word : NO_VERDICT.word;
}

/** The three verdicts defined in one line, in the order the PDF's note gives them (within, exceeds, inconclusive). */
export const VERDICT_DEFINITIONS = (['within', 'exceeds', 'inconclusive'] as const).map((v) => LEVEL_VERDICT_WORDS[v].definition).join(' ');

/** A method comparison's overall verdicts (the archive's badges), worst level first in the SQL that picks one. */
export const COMPARISON_STUDY_VERDICTS = LEVEL_VERDICTS.map((v) => LEVEL_VERDICT_WORDS[v].study);
