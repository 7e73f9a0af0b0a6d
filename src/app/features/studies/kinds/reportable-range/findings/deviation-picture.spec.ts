import { levelRows, rangeFormat } from '@shared/kinds/reportable-range/words';
import { along, deviationPicture } from './deviation-picture';
import { fractionRange, straightRange, tightRange } from './range-results.testing';

const F = rangeFormat('mmol/L', 1);

describe('the deviation at each level as a picture against the goal', () => {
  it('gives each level a track: the deviation, its CI and the goal from the engine, marked by shape', () => {
    const r = tightRange();
    const picture = deviationPicture(r, F);
    expect(picture.tracks.map((t) => [t.level, t.x, t.mark, t.word])).toEqual([
      ['Level 1', '2.0 mmol/L', 'half', 'Within (CI reaches beyond)'],
      ['Level 2', '8.0 mmol/L', 'filled', 'Within'],
      ['Level 3', '14.0 mmol/L', 'filled', 'Within'],
      ['Level 4', '20.0 mmol/L', 'open', 'Beyond the goal'],
      ['Level 5', '26.0 mmol/L', 'open', 'Beyond the goal'],
      ['Level 6', '32.0 mmol/L', 'open', 'Beyond the goal'],
    ]);
    r.levels.forEach((l, i) => {
      expect(picture.tracks[i]).toMatchObject({ deviation: l.deviation, ci: l.deviationCi, goal: l.goal, within: l.within });
    });
  });

  it('writes the numbers beside each track with the level table’s cells, and all of it for a screen reader', () => {
    const r = tightRange();
    const picture = deviationPicture(r, F);
    const row = levelRows(r, F)[5];
    expect(picture.tracks[5].lines).toEqual([`deviation ${row.deviation} mmol/L (${row.deviationPercent})`, `95% CI ${row.ci} mmol/L`, `allowable ${row.goal} mmol/L`]);
    expect(picture.tracks[5].lines).toEqual(['deviation −0.98 mmol/L (−3.2%)', '95% CI −1.07 to −0.90 mmol/L', 'allowable ±0.62 mmol/L']);
    expect(picture.tracks[5].summary).toBe('Level 6 (32.0 mmol/L): deviation −0.98 mmol/L (−3.2%), 95% CI −1.07 to −0.90 mmol/L, allowable ±0.62 mmol/L. Beyond the goal.');
    expect(picture.confidence).toBe('95%');
    expect(picture.bandCaption).toBe('Allowable nonlinearity 0.4 mmol/L or 2% of the level, whichever is larger (no source given)');
    const sourced = deviationPicture({ ...r, goal: { ...r.goal, source: 'Lab policy' } }, F);
    expect(sourced.bandCaption).toMatch(/whichever is larger \(source: Lab policy\)$/);
  });

  it('puts every band, CI and deviation on one axis symmetric about the straight line', () => {
    const picture = deviationPicture(tightRange(), F);
    const { axis } = picture;
    expect(axis.min).toBe(-axis.max);
    expect(axis.ticks).toContain(0);
    expect(axis.labels[0].startsWith('−')).toBe(true);
    for (const t of picture.tracks) {
      for (const v of [t.deviation, -t.goal, t.goal, ...(t.ci ?? [])]) {
        expect(along(axis, v)).toBeGreaterThan(0);
        expect(along(axis, v)).toBeLessThan(1);
      }
    }
    expect(axis.title).toBe('Deviation of the best fit from the straight line (mmol/L)');
  });

  it('says when the straight line fits best that there is no CI, and marks a CI narrower than one reporting step', () => {
    const straight = deviationPicture(straightRange(), F);
    expect(straight.tracks[0].lines[1]).toBe('no CI: the straight line fits best');
    expect(straight.tracks.every((t) => t.mark === 'filled' && t.deviation === 0)).toBe(true);
    expect(straight.axis.max).toBeGreaterThan(0.5);

    const fraction = fractionRange();
    const picture = deviationPicture(fraction, F);
    expect(fraction.resolution.limitedEstimates).toEqual(['levels.1.deviationCi', 'levels.3.deviationCi']);
    expect(picture.tracks[1].lines[1]).toMatch(/; CI narrower than one reporting step$/);
    expect(picture.tracks[0].lines[1]).not.toMatch(/reporting step/);
    expect(picture.tracks[0]).toMatchObject({ level: 'Low pool', x: 'fraction 0.000', mark: 'open' });
  });
});
