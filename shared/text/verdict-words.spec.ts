import { methodComparisonMeta } from '../kinds/method-comparison/meta';
import { levelSentence, verdictWord as pictureWord } from '../types/decision-track';
import { COMPARISON_STUDY_VERDICTS, LEVEL_VERDICT_WORDS, NO_VERDICT, VERDICT_DEFINITIONS, VERDICT_IN_LINE, VERDICT_WORDS, verdictWord } from './verdict-words';

// Written out here, not derived, so that a change of the wording fails a test.
describe('the words of the verdicts, in one place', () => {
  it('words a decision level verdict in each of its forms', () => {
    expect(['within', 'inconclusive', 'exceeds', null, undefined].map((v) => verdictWord(v as never))).toEqual(['Within', 'Inconclusive', 'Exceeds', 'No verdict', 'No verdict']);
    expect(VERDICT_WORDS).toEqual({
      within: 'Within the allowable bias', inconclusive: 'Inconclusive: the CI crosses the allowable bias', exceeds: 'Exceeds the allowable bias',
    });
    expect(VERDICT_IN_LINE).toEqual({
      within: 'within the allowable bias', inconclusive: 'inconclusive, the CI crosses the allowable bias', exceeds: 'exceeds the allowable bias',
    });
    expect(['within', 'inconclusive', 'exceeds'].map((v) => LEVEL_VERDICT_WORDS[v as 'within'].legend)).toEqual(['within', 'inconclusive', 'exceeds']);
  });

  it('ends a level sentence by what the CI or the interval judged on does against the limit; only an inconclusive one says the data cannot settle it', () => {
    expect(LEVEL_VERDICT_WORDS.within.against('ci', '±0.30 mmol/L')).toBe('the whole CI lies within the allowable ±0.30 mmol/L');
    expect(LEVEL_VERDICT_WORDS.exceeds.against('judged', '±0.30 mmol/L')).toBe('that whole interval lies beyond the allowable ±0.30 mmol/L');
    expect(LEVEL_VERDICT_WORDS.inconclusive.against('ci', '±5%')).toBe('the CI crosses the allowable ±5%, so these data cannot settle it');
    expect(LEVEL_VERDICT_WORDS.inconclusive.against('judged', '±5%')).toBe('that interval crosses the allowable ±5%, so these data cannot settle it');
  });

  it('is what the decision-level picture says (the screen and the PDF draw from it)', () => {
    expect(pictureWord).toBe(verdictWord);
    const level = { level: 5, bias: { estimate: 0.4, ci: [0.35, 0.45] as [number, number] }, allowable: 0.3, verdict: 'exceeds' as const };
    expect(levelSentence(level as never, { unit: 'mmol/L', decimals: 1 }, 0.95)).toBe(
      'At 5.0 mmol/L the predicted bias is 0.40 mmol/L (95% CI 0.35 to 0.45): the whole CI lies beyond the allowable ±0.30 mmol/L.',
    );
  });

  it("defines the three verdicts for the PDF's note", () => {
    expect(VERDICT_DEFINITIONS).toBe(
      'Within: the whole CI lies inside ±allowable. Exceeds: the whole CI lies outside it. ' +
      'Inconclusive: the CI crosses a limit, so the data can neither show agreement nor its absence.',
    );
  });

  it("gives a method comparison's overall verdicts and No verdict as one type, the archive's badges", () => {
    expect(methodComparisonMeta.verdicts).toBe(COMPARISON_STUDY_VERDICTS);
    expect(COMPARISON_STUDY_VERDICTS.map((v) => [v.key, v.tone, v.word])).toEqual([
      ['within', 'pass', 'Within goal'], ['inconclusive', 'open', 'Inconclusive'], ['exceeds', 'fail', 'Exceeds goal'],
    ]);
    expect(NO_VERDICT).toMatchObject({ key: 'none', tone: 'none', word: 'No verdict' });
  });
});
