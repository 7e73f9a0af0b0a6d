import { analyze, scratchFiles } from '../../test/cli';
import { RANGE_DEMOS } from './demo';

/** `npm run analyze -- reportable-range FILE.csv --settings SETTINGS.json`, run as other tools run it, in a child process. */

const file = scratchFiles('parallax-range-cli-');
const demo = RANGE_DEMOS[0];
const csv = ['level,replicate,value', ...demo.rows.map((r) => `${r.level},${r.replicate},${r.value}`)].join('\n');
const settings = { ...demo.settings, resamples: 2000, unit: 'mmol/L' };

describe('npm run analyze -- reportable-range', () => {
  it('prints the reportable-range contract for a CSV named by the row fields and the study settings', () => {
    const r = analyze('reportable-range', file('r.csv', csv), '--settings', file('s.json', JSON.stringify(settings)));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.kind).toBe('reportable-range');
    expect(out.bestDegree).toBe(3);
    expect(out.verifiedRange).toEqual({ low: 0.3, high: 28.3, lowLevel: 'Level 1', highLevel: 'Level 8' });
    expect(out.verdict).toBe('range-shortened');
    expect(out.levels).toHaveLength(9);
    expect(Object.keys(out.levels[0])).toEqual(expect.arrayContaining(['level', 'assigned', 'mean', 'sd', 'n', 'fitted', 'linear', 'deviation', 'deviationPercent', 'deviationCi', 'recoveryPercent', 'within']));
    expect(out.fits.map((f: { degree: number }) => f.degree)).toEqual([1, 2, 3]);
    expect(Object.keys(out.fits[0])).toEqual(expect.arrayContaining(['degree', 'coefficients', 'se', 'p', 'rss']));
    expect(out.engine).toMatchObject({ resamples: 2000, seed: 'vh-glucose-range-2026' });
    expect(out.caution).toMatch(/Decision support only/);
  });

  it('names a bad cell by its CSV row and line, and a bad setting by its path', () => {
    const bad = analyze('reportable-range', file('bad.csv', 'level,replicate,value\nLevel 1,1,0.3\nLevel 1,2,abc\n'), '--settings', file('s2.json', JSON.stringify(settings)));
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^analyze: row 2 \(line 3\): /);
    const setting = analyze('reportable-range', file('r2.csv', csv), '--settings', file('s3.json', JSON.stringify({ ...settings, poolHigh: null })));
    expect(setting.status).toBe(2);
    expect(setting.stderr).toMatch(/^analyze: --settings: poolHigh: Give both pool values or neither/);
  });
});
