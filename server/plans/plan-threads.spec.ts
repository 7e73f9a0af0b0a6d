import { planComparison, splitGrid } from '@shared/stats/plan-comparison';
import { AnalysisPool } from '../analyses/worker-pool';
import { runPlanOnThreads } from './plan-threads';

/** A plan split over worker threads gives the figures of one run over the whole grid, with progress that ends at 1. */
describe('a plan on several threads', () => {
  let pool: AnalysisPool;
  beforeAll(() => { pool = new AnalysisPool(2); });
  afterAll(() => pool.close());

  it('splits the grid by work and merges the parts into the one-thread result', async () => {
    expect(splitGrid([40, 60, 80, 100, 120, 160, 200], 2)).toEqual([[40, 60, 100, 200], [80, 120, 160]]);
    const plan = {
      cvComparative: 2, cvCandidate: 2.5, errorModel: 'proportional' as const, low: 3, high: 25, regression: 'passing-bablok' as const,
      decisionLevels: [7, 11.1], allowableBias: 0.3, allowableBiasPercent: 5, n: [30, 20, 50], simulations: 100, seed: 'threads',
    };
    const progress: number[] = [];
    const threaded = await runPlanOnThreads(pool, { kind: 'plan-comparison', plan }, (f) => progress.push(f));
    expect(threaded).toEqual(JSON.parse(JSON.stringify(planComparison(plan))));
    expect(threaded.rows.map((r) => r.n)).toEqual([20, 30, 50]);
    expect(progress.at(-1)).toBeCloseTo(1, 12);
    expect(progress.every((f, i) => i === 0 || f >= progress[i - 1])).toBe(true);
  });
});
