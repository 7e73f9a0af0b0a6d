import { RANGE_DEMO_ROWS, RANGE_DEMO_SETTINGS } from './demo-data';
import { analyzeReportableRange } from '../../stats/analyze-reportable-range';
import type { RangeOptions } from '../../stats/reportable-range-types';
import {
  claimSentence, coefficientText, fitRows, givenText, goalCaption, goalText, levelRows, rangeFormat, rangeText, trackWords, verdictSentence, withinWord,
} from './words';

const f = rangeFormat('mmol/L', 2);
const demo = (more: Partial<RangeOptions> = {}) => analyzeReportableRange(
  RANGE_DEMO_ROWS.map((r) => ({ ...r, value: Number(r.value) })),
  { ...(RANGE_DEMO_SETTINGS as unknown as RangeOptions), unit: 'mmol/L', resamples: 1000, ...more },
);

describe('the reportable range in words', () => {
  it('writes the demo verdict with the range, the level beyond the goal and the claimed end it misses', () => {
    const r = demo();
    expect(verdictSentence(r, f)).toBe(r.verdictWords);
    expect(rangeText(r, f)).toBe('0.30 to 28.30 mmol/L (levels "Level 1" to "Level 8")');
    expect(claimSentence(r, f)).toBe(' It does not reach the claimed high end (32.00 mmol/L).');
    expect(claimSentence({ ...r, coversClaim: true }, f)).toBe(' It covers the claimed measuring interval.');
    expect(claimSentence({ ...r, coversClaim: null }, f)).toBe('');
  });

  it('writes each goal as it was given, and which applies when both are', () => {
    expect(goalText({ absolute: 0.5, percent: 1.5 }, f)).toBe('0.50 mmol/L or 1.5% of the level, whichever is larger');
    expect(goalText({ absolute: null, percent: 3 }, f)).toBe('3% of the level');
    expect(goalText({ absolute: 0.125, percent: null }, f)).toBe('0.125 mmol/L');
    expect(goalText(null, f)).toBe('not set');
    expect(goalCaption({ absolute: 0.5, percent: null, source: ' ' }, f)).toBe('Allowable nonlinearity 0.50 mmol/L (no source given)');
    expect(givenText(12.200000000000001, f)).toBe('12.20');
  });

  it('gives the level table, the judgement and the track the same numbers', () => {
    const r = demo();
    const rows = levelRows(r, f);
    const tracks = trackWords(r, f);
    expect(rows[8]).toMatchObject({ level: 'Level 9', x: '32.30', n: '2', within: 'Beyond the goal', goal: '±0.500' });
    expect(tracks[8].mark).toBe('open');
    expect(tracks[8].at).toBe('32.30 mmol/L');
    expect(tracks[8].lines).toEqual([
      `deviation ${rows[8].deviation} mmol/L (${rows[8].deviationPercent})`, `95% CI ${rows[8].ci} mmol/L`, 'allowable ±0.500 mmol/L',
    ]);
    expect(withinWord({ within: true, ciBeyondGoal: true })).toBe('Within (CI reaches beyond)');
    const line = demo({ allowableNonlinearity: 5 });
    expect(trackWords(line, f).every((t) => t.mark === 'filled')).toBe(true);
  });

  it('lists the fits with the best one named and the straight line without a p', () => {
    const rows = fitRows(demo(), f);
    expect(rows.map((x) => [x.degree, x.p === '—', x.judgement])).toEqual([
      ['1', true, ''], ['2', false, 'Top coefficient differs from 0'], ['3', false, 'Best fit'],
    ]);
    expect(coefficientText(-0.000123456789)).toBe('−0.000123457');
  });
});
