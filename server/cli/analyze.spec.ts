import { analyze, scratchFiles } from '../test/cli';

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
    expect(JSON.parse(t.stdout)).toEqual(expect.objectContaining({ observed: expect.any(Number), pValue: expect.any(Number), upperTail: expect.any(Number), lowerTail: expect.any(Number) }));
  });
});
