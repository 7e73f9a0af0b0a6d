import { planComparison } from '@shared/stats/plan-comparison';
import { analyze, scratchFiles } from '../test/cli';

const file = scratchFiles('parallax-plan-cli-');

/** The PLAN.json fields, an invented glucose plan small enough to run in a second. */
const PLAN = {
  cvComparative: 2.5, cvCandidate: 3, errorModel: 'proportional', low: 3, high: 25, shape: 'uniform', regression: 'deming', differenceType: 'absolute',
  decisionLevels: [7, 11.1], allowableBias: 0.3, allowableBiasPercent: 5, n: [40, 20], simulations: 100, seed: 'cli-plan',
};

describe('npm run analyze -- plan-comparison', () => {
  it('prints the contract: kind, rows of n with power at 0, at half and the false-pass risk per level, the recommended n, simulations, seed, engine', () => {
    const r = analyze('plan-comparison', '--settings', file('plan.json', JSON.stringify(PLAN)));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out).toMatchObject({ kind: 'plan-comparison', simulations: 100, seed: 'cli-plan', engine: { seed: 'cli-plan', version: expect.stringMatching(/^parallax-stats /) } });
    expect(out.rows.map((row: { n: number }) => row.n)).toEqual([20, 40]);
    for (const row of out.rows) {
      expect(row.levels.map((l: { level: number }) => l.level)).toEqual([7, 11.1]);
      for (const l of row.levels) for (const key of ['powerAtZero', 'powerAtHalf', 'falsePass']) expect(l[key]).toEqual(expect.any(Number));
    }
    expect('recommendedN' in out).toBe(true);
    // The engine's own figures for the same plan, as printed.
    expect(out).toEqual(JSON.parse(JSON.stringify(planComparison(PLAN as Parameters<typeof planComparison>[0]))));
  });

  it('names the field of PLAN.json that is wrong, in one line, and exits 2', () => {
    const r = analyze('plan-comparison', '--settings', file('bad.json', JSON.stringify({ ...PLAN, decisionLevels: [] })));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/bad\.json: decisionLevels must name at least one decision level/);
    const missing = analyze('plan-comparison');
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/--settings PLAN\.json is required/);
  });
});

describe('npm run analyze -- plan-transference', () => {
  it('prints the probability of accepting at the first 20 and with the retest of 20 more, per true fraction outside', () => {
    const r = analyze('plan-transference', '--n', '20', '--max-outside', '2', '--outside', '0.025,0.05,0.1,0.2');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.kind).toBe('plan-transference');
    expect(out.rows.map((row: { trueOutside: number }) => row.trueOutside)).toEqual([0.025, 0.05, 0.1, 0.2]);
    // P(X ≤ 2), X ~ Binomial(20, 0.1) = 0.676927 (scipy.stats.binom.cdf(2, 20, 0.1)); with the retest 1 − (1 − 0.676927)².
    const tenth = out.rows[2];
    expect(tenth.acceptFirst).toBeCloseTo(0.6769268, 6);
    expect(tenth.acceptWithRetest).toBeCloseTo(1 - (1 - 0.6769268) ** 2, 6);
  });

  it('names the flag of a bad value', () => {
    const r = analyze('plan-transference', '--n', '20', '--outside', '0.1,1.5');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--outside: must be a list of numbers, each a fraction from 0 to 1/);
  });
});

describe('npm run analyze -- plan-establish', () => {
  it('prints the ranks of the 90% CI of each limit and its expected span per n', () => {
    const r = analyze('plan-establish', '--n', '100,120');
    expect(r.status).toBe(0);
    const [small, enough] = JSON.parse(r.stdout).rows;
    expect(small.limits[0].lowerRank).toBeNull();
    expect(enough.limits.map((l: { lowerRank: number; upperRank: number }) => [l.lowerRank, l.upperRank])).toEqual([[1, 7], [114, 120]]);
  });
});
