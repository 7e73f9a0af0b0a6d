import { analyze, scratchFiles } from '../../test/cli';
import { precisionRuns } from './runs';

/** `npm run analyze -- precision FILE.csv --settings SETTINGS.json`, run as other tools run it, in a child process. */

const file = scratchFiles('parallax-precision-cli-');

const rows = [
  ...precisionRuns('vh-prec-low', 'Low', ['1', '2', '3', '4', '5'], 5, 5.42, 0.06, 0.03, 2),
  ...precisionRuns('vh-prec-high', 'High', ['1', '2', '3', '4', '5'], 5, 16.8, 0.15, 0.2, 2),
];
const csv = ['material,day,replicate,value', ...rows.map((r) => `${r.material},${r.day},${r.replicate},${r.value}`)].join('\n');
const settings = {
  decimals: 2,
  materials: [
    { name: 'Low', claimRepeatability: 0.08, claimWithinLab: 0.12, claimAs: 'sd' },
    { name: 'High', claimRepeatability: 1.0, claimWithinLab: 1.4, claimAs: 'cv' },
  ],
};

describe('npm run analyze -- precision', () => {
  it('prints the precision contract for a CSV named by the row fields and the study settings', () => {
    const r = analyze('precision', file('p.csv', csv), '--settings', file('s.json', JSON.stringify(settings)));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.kind).toBe('precision');
    expect(out.materials.map((m: { name: string; n: number; verdicts: object }) => [m.name, m.n, m.verdicts])).toEqual([
      ['Low', 25, { repeatability: 'verified', withinLab: 'verified' }],
      ['High', 25, { repeatability: 'verified', withinLab: 'consistent' }],
    ]);
    for (const key of ['repeatability', 'withinLab']) expect(out.materials[0][key]).toEqual(expect.objectContaining({ sd: expect.any(Number), cv: expect.any(Number), df: expect.any(Number), ci: expect.any(Object) }));
    expect(out.caution).toMatch(/Decision support only/);
  });

  it('names a bad cell by its CSV row and line, a column no row has, and a bad setting', () => {
    const bad = analyze('precision', file('bad.csv', 'material,day,replicate,value\nLow,1,1,5.4\nLow,1,x,5.5\n'), '--settings', file('s2.json', JSON.stringify(settings)));
    expect(bad.status).toBe(2);
    expect(bad.stderr).toBe('analyze: row 2 (line 3): replicate "x" must be a whole number from 1\n');
    const column = analyze('precision', file('col.csv', 'material,day,run,value\nLow,1,1,5.4\n'), '--settings', file('s3.json', JSON.stringify(settings)));
    expect(column.stderr).toMatch(/^analyze: column "run" is not a field of precision rows; the columns are material, day, replicate, value, excluded, exclusionReason, note/);
    const setting = analyze('precision', file('p2.csv', csv), '--settings', file('s4.json', JSON.stringify({ materials: [{ ...settings.materials[0], claimAs: 'ratio' }] })));
    expect(setting.status).toBe(2);
    expect(setting.stderr).toMatch(/^analyze: --settings: materials\.0\.claimAs: /);
  });
});
