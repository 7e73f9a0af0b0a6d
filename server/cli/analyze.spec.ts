import { KIND_METAS } from '@shared/kinds/kinds';
import { analyzeComparison, bootstrapTest } from '@shared/stats';
import { analyze, scratchFiles } from '../test/cli';
import { KINDS } from './kinds';

const file = scratchFiles('parallax-cli-');

const pairs = ['specimen,x,y', ...Array.from({ length: 30 }, (_, i) => `S${i + 1},${(4 + i * 0.5).toFixed(1)},${(4.1 + i * 0.5 + ((i % 3) - 1) * 0.1).toFixed(1)}`)].join('\n');

describe('npm run analyze', () => {
  it('prints one JSON object with the contract fields for a comparison', () => {
    const r = analyze('comparison', file('pairs.csv', pairs), '--resamples', '1000', '--regression-resamples', '1000', '--seed', 'cli', '--decision-levels', '7,11', '--allowable-bias', '0.3');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.n).toBe(30);
    for (const key of ['mean', 'median']) expect(out.bias[key]).toEqual(expect.objectContaining({ estimate: expect.any(Number), ci: [expect.any(Number), expect.any(Number)], pValue: expect.any(Number) }));
    expect(out.limitsOfAgreement.lower.ci).toHaveLength(2);
    expect(out.regression).toEqual(expect.objectContaining({ method: 'passing-bablok', slope: expect.any(Object), intercept: expect.any(Object) }));
    expect(out.decisionLevels.map((d: { level: number }) => d.level)).toEqual([7, 11]);
    expect(out.engine).toEqual(expect.objectContaining({ seed: 'cli', resamples: 1000 }));
    // Every flag reached the engine: the output is the engine's own answer for the same rows and options.
    const rows = Array.from({ length: 30 }, (_, i) => ({ x: Number((4 + i * 0.5).toFixed(1)), y: Number((4.1 + i * 0.5 + ((i % 3) - 1) * 0.1).toFixed(1)), label: `S${i + 1}`, excluded: false }));
    const direct = analyzeComparison(rows, { resamples: 1000, regressionResamples: 1000, seed: 'cli', decisionLevels: [7, 11], allowableBias: 0.3 });
    expect(out).toEqual(JSON.parse(JSON.stringify(direct)));
  });

  it('answers one line naming the row of a bad value, and exits 2', () => {
    const r = analyze('comparison', file('bad.csv', 'x,y\n1,2\n3,oops\n'));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/row 2|line 3/);
  });

  it('answers one line naming a bad option, and exits 2', () => {
    const r = analyze('comparison', file('pairs2.csv', pairs), '--resamples', '10');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--resamples/);
  });

  it('verifies an interval and runs the bootstrap test', () => {
    const values = file('values.csv', ['value', ...Array.from({ length: 20 }, (_, i) => String(3.6 + i * 0.07))].join('\n'));
    const v = analyze('verify-interval', values, '--lower', '3.5', '--upper', '5.1');
    expect(JSON.parse(v.stdout)).toEqual(expect.objectContaining({ n: 20, outside: 0, accepted: true }));
    const t = analyze('bootstrap-test', values, '--statistic', 'median', '--null', '4', '--resamples', '1000', '--seed', 's');
    const test = JSON.parse(t.stdout);
    expect(test).toEqual(expect.objectContaining({ observed: expect.any(Number), pValue: expect.any(Number), upperTail: expect.any(Number), lowerTail: expect.any(Number) }));
    // The median of 3.6 + 0.07·i (i = 0…19) is the mean of i = 9 and 10: 4.265; the rest is the engine's own answer.
    expect(test.observed).toBeCloseTo(4.265, 12);
    const direct = bootstrapTest(Array.from({ length: 20 }, (_, i) => Number(String(3.6 + i * 0.07))), { statistic: 'median', null: 4, resamples: 1000, seed: 's' });
    expect(test).toEqual(JSON.parse(JSON.stringify(direct)));
  });

  it("keeps the engine commands the README documents, each named from the registry as the result of a study kind it runs", () => {
    // Command names users type (README: analyze -- comparison FILE.csv …); not study kinds, which run by their own names.
    expect(Object.keys(KINDS).sort()).toEqual(['bootstrap-test', 'comparison', 'interval', 'verify-interval']);
    const results = new Set<string>(KIND_METAS.map((m) => m.resultKind));
    expect(Object.keys(KINDS).filter((k) => k !== 'bootstrap-test').every((k) => results.has(k))).toBe(true);
    const values = file('verify.csv', ['value', '3.4', ...Array.from({ length: 19 }, () => '4.2')].join('\n'));
    const v = JSON.parse(analyze('verify-interval', values, '--lower', '3.5', '--upper', '5.1').stdout);
    expect(v).toMatchObject({ kind: 'verify-interval', n: 20, outside: 1, below: 1, above: 0, accepted: true });
  });
});
