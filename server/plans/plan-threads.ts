import { mergePlans, resolveComparisonPlan, splitGrid, type ComparisonPlanResult } from '@shared/stats/plan-comparison';
import type { AnalysisPool } from '../analyses/worker-pool';
import type { PlanInput } from './plan-input';

/**
 * Runs a plan on every thread of the pool at once: the grid is split into parts of about equal work, each part runs
 * in its own thread and the parts are merged (mergePlans), which gives the figures one thread would give. Progress
 * is the parts' progress weighted by their work. A pool of one thread runs the plan whole.
 */
export async function runPlanOnThreads(pool: AnalysisPool, input: PlanInput, onProgress: (f: number) => void): Promise<ComparisonPlanResult> {
  const groups = splitGrid(resolveComparisonPlan(input.plan).n, pool.threads);
  if (groups.length === 1) return (await pool.run(input, onProgress)) as ComparisonPlanResult;
  const work = groups.map((ns) => ns.reduce((a, b) => a + b, 0));
  const total = work.reduce((a, b) => a + b, 0);
  const done = groups.map(() => 0);
  const parts = await Promise.all(groups.map(async (ns, k) => (await pool.run({ ...input, plan: { ...input.plan, n: ns } }, (f) => {
    done[k] = f;
    onProgress(done.reduce((sum, d, j) => sum + (d * work[j]) / total, 0));
  })) as ComparisonPlanResult));
  return mergePlans(parts);
}
