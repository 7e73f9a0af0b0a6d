import type { DecisionLevelResult } from '../stats/comparison-types';
import type { ComparisonResolution } from '../stats/resolution';
import { along, decisionPicture, levelSentence, verdictWord, type TrackResult } from './decision-track';

// Fixed inputs in the shape the engine returns (comparison-core.ts); the numbers are invented, the verdicts and
// judgedOn are what the engine's rules give for them (decision-levels.ts, resolution.ts).
const level = (at: number, estimate: number, ci: [number, number] | null, allowable: number | null, verdict: DecisionLevelResult['verdict'], judgedOn: [number, number] | null = null): DecisionLevelResult => ({
  level: at, bias: { estimate, ci }, biasPercent: (100 * estimate) / at, allowable, verdict, judgedOn,
});

const resolution = (increment: number, limitedEstimates: string[]): ComparisonResolution => ({
  increment, source: 'analyte', limitedEstimates, differenceIncrement: increment, slopeIncrement: null,
});

/** Glucose in steps of 0.1 mmol/L, ±0.30 mmol/L allowed: within at 3, inconclusive at 10, exceeds at 20 (judged on the floor). */
const glucose: TrackResult = {
  n: 39,
  settings: { level: 0.95, allowableBias: 0.3, allowableBiasPercent: null },
  regression: { method: 'passing-bablok' },
  resolution: resolution(0.1, ['sd', 'decisionLevels.2']),
  decisionLevels: [
    level(3, 0.05, [0.01, 0.17], 0.3, 'within'),
    level(10, 0.3, [0.2, 0.4], 0.3, 'inconclusive'),
    level(20, 0.66, [0.61, 0.69], 0.3, 'exceeds', [0.61, 0.71]),
  ],
};
const GLUCOSE_GOAL = { absolute: 0.3, percent: null, source: 'Laboratory policy QP-12' };
const MMOL = { unit: 'mmol/L', decimals: 1 };

/** Sodium in whole mmol/L: the CIs collapse to one value and the verdicts are judged on the estimate ± half a step. */
const sodium: TrackResult = {
  n: 60,
  settings: { level: 0.95, allowableBias: 2, allowableBiasPercent: null },
  regression: { method: 'deming' },
  resolution: resolution(1, ['bias.median', 'decisionLevels.0', 'decisionLevels.1']),
  decisionLevels: [level(130, 1, [1, 1], 2, 'within', [0.5, 1.5]), level(150, 1, [1, 1], 2, 'within', [0.5, 1.5])],
};

describe('the decision-level picture', () => {
  const picture = decisionPicture(glucose, GLUCOSE_GOAL, MMOL);
  const [low, middle, high] = picture.tracks;

  it('gives each level its verdict word, what it means, and a mark of its own shape', () => {
    expect(picture.tracks.map((t) => [t.word, t.mark])).toEqual([['Within', 'filled'], ['Inconclusive', 'half'], ['Exceeds', 'open']]);
    expect(low.reason).toBe('the whole CI lies inside the allowable band');
    expect(middle.reason).toBe('the CI crosses an edge of the allowable band');
    expect(high.reason).toBe('the whole interval judged on lies beyond the allowable band');
  });

  it("draws the engine's numbers: the band at ± its allowable bias, the estimate, the CI and the floor", () => {
    expect(low).toMatchObject({ key: 'decisionLevels.0', level: 3, at: '3.0 mmol/L', estimate: 0.05, ci: [0.01, 0.17], floor: null });
    expect(low.band).toEqual({ half: 0.3, basis: 'absolute', text: '±0.30 mmol/L' });
    expect(high).toMatchObject({ floor: [0.61, 0.71], floorText: '0.61 to 0.71 mmol/L', ciText: '0.61 to 0.69', bias: '0.66 mmol/L', biasPercent: '3.3%' });
    expect(picture.hasFloor).toBe(true);
    expect(low.lines).toEqual(['0.05 mmol/L, 95% CI 0.01 to 0.17', 'allowable ±0.30 mmol/L']);
    expect(high.lines).toEqual(['0.66 mmol/L, 95% CI 0.61 to 0.69', 'judged on 0.61 to 0.71 mmol/L', 'allowable ±0.30 mmol/L']);
  });

  it('keeps the verdict the engine gave, without judging anew', () => {
    const odd = { ...glucose, decisionLevels: [level(3, 0.05, [0.01, 0.17], 0.3, 'inconclusive')] };
    expect(decisionPicture(odd, GLUCOSE_GOAL, MMOL).tracks[0]).toMatchObject({ word: 'Inconclusive', mark: 'half' });
  });

  it('lays the tracks on one axis symmetric about zero that holds every band, CI and floor, with ticks in the decimals of the tables', () => {
    const { axis } = picture;
    expect([axis.min, axis.max]).toEqual([-1, 1]);
    expect(axis.ticks).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(axis.labels).toEqual(['−1.00', '−0.50', '0.00', '0.50', '1.00']);
    expect(axis.title).toBe('Predicted bias at the level, candidate − comparative (mmol/L)');
    for (const t of picture.tracks) {
      for (const v of [t.estimate!, ...t.ci!, ...(t.floor ?? []), -t.band!.half, t.band!.half]) {
        expect(along(axis, v)).toBeGreaterThan(0);
        expect(along(axis, v)).toBeLessThan(1);
      }
    }
    expect(along(axis, 0)).toBe(0.5);
    expect(along(axis, 0.3)).toBeCloseTo(0.65, 12);
  });

  it('summarises each track in words for a screen reader', () => {
    expect(low.summary).toBe('At 3.0 mmol/L: predicted bias 0.05 mmol/L, 95% CI 0.01 to 0.17; allowable ±0.30 mmol/L. Within: the whole CI lies inside the allowable band.');
    expect(high.summary).toBe(
      'At 20.0 mmol/L: predicted bias 0.66 mmol/L, 95% CI 0.61 to 0.69; the CI is narrower than one reporting step, judged on 0.61 to 0.71 mmol/L; ' +
      'allowable ±0.30 mmol/L. Exceeds: the whole interval judged on lies beyond the allowable band.',
    );
  });

  it('concludes in two sentences: the verdict at each level, then on what it rests', () => {
    expect(picture.conclusion).toBe(
      'Within the allowable bias at 3.0 mmol/L; inconclusive at 10.0 mmol/L; exceeds it at 20.0 mmol/L. ' +
      'Judged on the 95% CI of the bias that the Passing–Bablok regression of 39 pairs predicts at each level; ' +
      'at 20.0 mmol/L that CI is narrower than one reporting step, so the verdict is judged on the estimate ± half a step.',
    );
    expect(picture.bandCaption).toBe('Allowable bias ±0.30 mmol/L (source: Laboratory policy QP-12)');
  });
});

describe('the picture of results in whole steps (the floor)', () => {
  const picture = decisionPicture(sodium, { absolute: 2, percent: null, source: '' }, { unit: 'mmol/L', decimals: 0 });

  it('shows the floor each verdict was judged on when the CI collapses to one value', () => {
    for (const t of picture.tracks) {
      expect(t).toMatchObject({ ci: [1, 1], floor: [0.5, 1.5], floorText: '0.5 to 1.5 mmol/L', word: 'Within', mark: 'filled' });
      expect(t.reason).toBe('the whole interval judged on lies inside the allowable band');
    }
    expect(picture.tracks[0].sentence).toBe(
      'At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L), so the verdict is judged on ' +
      '0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies within the allowable ±2.0 mmol/L.',
    );
  });

  it('writes its axis with one decimal, wide enough for the band', () => {
    expect(picture.axis.ticks).toEqual([-3, -2, -1, 0, 1, 2, 3]);
    expect(picture.axis.labels[0]).toBe('−3.0');
  });

  it('concludes for every level at once and names the floor', () => {
    expect(picture.conclusion).toBe(
      'The predicted bias is within the allowable bias at every decision level (130 and 150 mmol/L). ' +
      'Judged on the 95% CI of the bias that the Deming regression of 60 pairs predicts at each level; ' +
      'at 130 and 150 mmol/L that CI is narrower than one reporting step, so the verdict is judged on the estimate ± half a step.',
    );
    expect(picture.bandCaption).toBe('Allowable bias ±2.0 mmol/L (no source given)');
  });
});

describe('the band of a goal stated in percent, or both ways', () => {
  const levels = [level(3, 0.05, [0.01, 0.17], 0.3, 'within'), level(10, 0.3, [0.2, 0.4], 0.5, 'within')];

  it('says the band is a percentage of the level', () => {
    const result = { ...glucose, settings: { level: 0.95, allowableBias: null, allowableBiasPercent: 5 }, decisionLevels: [level(10, 0.3, [0.2, 0.4], 0.5, 'within')] };
    const picture = decisionPicture(result, { absolute: null, percent: 5, source: 'EFLM' }, MMOL);
    expect(picture.tracks[0].band).toEqual({ half: 0.5, basis: 'percent', text: '±0.50 mmol/L (5% of the level)' });
    expect(picture.goal).toBe('±5% of the level');
  });

  it('says which limit is the greater at each level when both are set', () => {
    const result = { ...glucose, settings: { level: 0.95, allowableBias: 0.3, allowableBiasPercent: 5 }, decisionLevels: levels };
    const picture = decisionPicture(result, { absolute: 0.3, percent: 5, source: '' }, MMOL);
    expect(picture.tracks.map((t) => t.band!.text)).toEqual(['±0.30 mmol/L (the absolute limit)', '±0.50 mmol/L (5% of the level)']);
    expect(picture.goal).toBe('±0.30 mmol/L or ±5% of the level, whichever is greater');
  });
});

describe('a picture without a verdict', () => {
  it('says so when no decision level is set', () => {
    const picture = decisionPicture({ ...glucose, decisionLevels: [] }, GLUCOSE_GOAL, MMOL);
    expect(picture.tracks).toEqual([]);
    expect(picture.conclusion).toBe('No medical decision levels are set, so no verdict is given; the bias and the regression describe the agreement.');
  });

  it('draws no band and gives no verdict when no allowable bias is set', () => {
    const result = { ...glucose, settings: { level: 0.9, allowableBias: null, allowableBiasPercent: null }, decisionLevels: [level(3, 0.05, [0.01, 0.17], null, null)] };
    const picture = decisionPicture(result, { absolute: null, percent: null, source: '' }, MMOL);
    expect(picture.tracks[0]).toMatchObject({ band: null, word: 'No verdict', mark: 'none', reason: 'no allowable bias is set' });
    expect(picture.conclusion).toBe('No allowable bias is set, so no verdict is given at the decision level (3.0 mmol/L); the picture shows the predicted bias and its CI.');
    expect(picture.confidence).toBe('90%');
    expect(picture.bandCaption).toBe('No allowable bias is set, so no band is drawn');
  });

  it('captions the band as drawn when the results do not say how the goal was stated', () => {
    const result = { ...glucose, settings: { level: 0.95 } };
    expect(decisionPicture(result, { absolute: null, percent: null, source: 'QP-12' }, MMOL).bandCaption).toBe('Allowable bias ±0.30 mmol/L (source: QP-12)');
  });

  it('reads results of an older engine that lack fields', () => {
    const picture = decisionPicture({ decisionLevels: [{ level: 3, bias: { estimate: 0.1, ci: null }, biasPercent: null, allowable: 0.3, verdict: null } as DecisionLevelResult] }, GLUCOSE_GOAL, MMOL);
    expect(picture.tracks[0]).toMatchObject({ word: 'No verdict', reason: 'the CI could not be formed', ciText: 'not available', floor: null });
    expect(picture.conclusion).toBe('No verdict at 3.0 mmol/L. Judged on the 95% CI of the bias that the regression predicts at each level.');
  });
});

describe('the words shared by the findings and the PDF', () => {
  it('names the verdicts', () => {
    expect(['within', 'inconclusive', 'exceeds', null].map((v) => verdictWord(v as never))).toEqual(['Within', 'Inconclusive', 'Exceeds', 'No verdict']);
  });

  const at7 = (verdict: DecisionLevelResult['verdict'], ci: [number, number] | null, allowable: number | null = 0.28): DecisionLevelResult => ({
    level: 7, bias: { estimate: 0.12, ci }, biasPercent: 1.7, allowable, verdict, judgedOn: null,
  });
  const collapsed = (verdict: DecisionLevelResult['verdict'], judgedOn: [number, number] | null): DecisionLevelResult => ({
    level: 130, bias: { estimate: 1, ci: [1, 1] }, biasPercent: 0.8, allowable: verdict === 'exceeds' ? 0.4 : verdict === 'inconclusive' ? 1.2 : 2, verdict, judgedOn,
  });
  const SODIUM = { unit: 'mmol/L', decimals: 0 };

  it('says a level is within when the whole CI lies inside the allowable bias, with the decimals of the tables', () => {
    expect(levelSentence(at7('within', [0.05, 0.19]), MMOL, 0.95)).toBe(
      'At 7.0 mmol/L the predicted bias is 0.12 mmol/L (95% CI 0.05 to 0.19): the whole CI lies within the allowable ±0.28 mmol/L.',
    );
  });

  it('says the data cannot settle it when the CI crosses the limit, and names exceeding', () => {
    expect(levelSentence(at7('inconclusive', [0.2, 0.35]), MMOL, 0.9)).toContain('(90% CI 0.20 to 0.35): the CI crosses the allowable ±0.28 mmol/L, so these data cannot settle it.');
    expect(levelSentence(at7('exceeds', [-0.5, -0.3]), MMOL, 0.95)).toContain('CI \u22120.50 to \u22120.30): the whole CI lies beyond the allowable ±0.28 mmol/L.');
  });

  it('says the verdict was judged on the estimate ± half a step when the CI is narrower than the step', () => {
    expect(levelSentence(collapsed('within', [0.5, 1.5]), SODIUM, 0.95, '1 mmol/L')).toBe(
      'At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L), ' +
        'so the verdict is judged on 0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies within the allowable ±2.0 mmol/L.',
    );
    expect(levelSentence(collapsed('exceeds', [0.5, 1.5]), SODIUM, 0.95, '1 mmol/L')).toContain('judged on 0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies beyond the allowable ±0.4 mmol/L.');
    expect(levelSentence(collapsed('inconclusive', [0.5, 1.5]), SODIUM, 0.95, '1 mmol/L')).toContain('that interval crosses the allowable ±1.2 mmol/L, so these data cannot settle it.');
  });

  it('judges on the CI itself, saying nothing of the step, when judgedOn is null or absent (results of engine 1.1.0)', () => {
    const judged = levelSentence(collapsed('within', null), SODIUM, 0.95, '1 mmol/L');
    expect(judged).toBe('At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0): the whole CI lies within the allowable ±2.0 mmol/L.');
    const { judgedOn: _, ...old } = collapsed('within', null);
    expect(levelSentence(old as DecisionLevelResult, SODIUM, 0.95)).toBe(judged);
  });

  it('explains why there is no verdict', () => {
    expect(levelSentence(at7(null, [0, 0.2], null), MMOL, 0.95)).toContain('No allowable bias is set for this study, so there is no verdict.');
    expect(levelSentence(at7(null, null), MMOL, 0.95)).toContain('CI not available). The CI could not be formed, so there is no verdict.');
  });
});
