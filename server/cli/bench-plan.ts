/**
 * The plan workload of `npm run bench`: a 1,000-study plan over a 7-point grid of n (40 to 200) for Deming and for
 * Passing–Bablok, timed once each in this process (one thread), beside the straightforward way timed on a few
 * studies and scaled: every simulated study analysed in full (analyzeComparison with its default resamples, 10,000
 * and 2,000 for the regression) once for each of the three truths. Then the same plans on two worker threads (the
 * grid split in two, as the analysis queue runs a plan on a pool of several threads), checked to give the same
 * figures as the one-thread run.
 */
import { analyzeComparison } from '@shared/stats';
import { isDeepStrictEqual } from 'node:util';
import { planComparison, type ComparisonPlanOptions } from '@shared/stats/plan-comparison';
import { AnalysisPool } from '../analyses/worker-pool';
import { runPlanOnThreads } from '../plans/plan-threads';

const GRID = [40, 60, 80, 100, 120, 160, 200];
const SIMULATIONS = 1000;
/** Studies per n the straightforward way is timed on (3 truths each); its time is scaled to SIMULATIONS. */
const NAIVE_STUDIES = 2;
export const PLAN_TARGET_SECONDS = 30;

/** An invented glucose plan (mmol/L): proportional error 2.5% and 3%, range 3 to 25, two decision levels. */
const plan = (regression: 'deming' | 'passing-bablok'): ComparisonPlanOptions => ({
  cvComparative: 2.5, cvCandidate: 3, errorModel: 'proportional', low: 3, high: 25, shape: 'uniform', regression,
  decisionLevels: [7, 11.1], allowableBias: 0.3, allowableBiasPercent: 5, n: GRID, simulations: SIMULATIONS, seed: 'bench-plan', decimals: 2,
});

export interface PlanBenchRow {
  regression: string; seconds: number; naiveSeconds: number; recommendedN: number | null; resamples: number;
  twoThreadSeconds: number; sameFigures: boolean;
}

export async function planBench(log: (line: string) => void = () => {}): Promise<PlanBenchRow[]> {
  const pool = new AnalysisPool(2);
  await pool.warmUp();
  const rows: PlanBenchRow[] = [];
  for (const regression of ['deming', 'passing-bablok'] as const) {
    const start = performance.now();
    const result = planComparison(plan(regression));
    const seconds = (performance.now() - start) / 1000;
    log(`  plan ${regression}: ${seconds.toFixed(1)} s`);
    // The straightforward way: a full analysis of each simulated study, once per truth (bias 0, half, whole goal).
    const naiveStart = performance.now();
    for (const n of GRID) {
      for (let j = 0; j < NAIVE_STUDIES; j++) {
        const x = Array.from({ length: n }, (_, i) => 3 + (22 * ((i * 7919 + j * 104729) % n)) / n);
        for (const shift of [0, 0.175, 0.35]) {
          analyzeComparison(x.map((v, i) => ({ x: Math.round(v * 100) / 100, y: Math.round((v * (1 + 0.03 * Math.sin(i + j)) + shift) * 100) / 100 })),
            { regression, decisionLevels: [7, 11.1], allowableBias: 0.3, allowableBiasPercent: 5, seed: `naive-${n}-${j}` });
        }
      }
    }
    const naiveSeconds = ((performance.now() - naiveStart) / 1000) * (SIMULATIONS / NAIVE_STUDIES);
    log(`  plan ${regression}, straightforward way (scaled): ${naiveSeconds.toFixed(0)} s`);
    const threadStart = performance.now();
    const threaded = await runPlanOnThreads(pool, { kind: 'plan-comparison', plan: plan(regression) }, () => {});
    const twoThreadSeconds = (performance.now() - threadStart) / 1000;
    log(`  plan ${regression} on two threads: ${twoThreadSeconds.toFixed(1)} s`);
    rows.push({
      regression, seconds: Math.round(seconds * 10) / 10, naiveSeconds: Math.round(naiveSeconds), recommendedN: result.recommendedN, resamples: result.resamples,
      twoThreadSeconds: Math.round(twoThreadSeconds * 10) / 10, sameFigures: isDeepStrictEqual(threaded, result),
    });
  }
  await pool.close();
  return rows;
}

export function planBlock(rows: PlanBenchRow[]): string {
  return [
    `plan: ${SIMULATIONS.toLocaleString('en-US')} simulated studies at each n of ${GRID.join(', ')} (one thread), against analysing each study in full once per truth (timed on ${NAIVE_STUDIES} studies per n and scaled):`,
    ...rows.map((r) => `  ${r.regression.padEnd(15)} ${r.seconds.toFixed(1).padStart(6)} s   straightforward ${r.naiveSeconds.toLocaleString('en-US').padStart(7)} s   (${(r.naiveSeconds / r.seconds).toFixed(0)}x; ${r.resamples} resamples per simulated study; recommends n = ${r.recommendedN ?? 'none'})`),
    ...rows.map((r) => `  ${r.regression.padEnd(15)} ${r.twoThreadSeconds.toFixed(1).padStart(6)} s   on two worker threads (the grid split in two), ${r.sameFigures ? 'the same figures' : 'FIGURES DIFFER from the one-thread run'}`),
    ...rows.map((r) => `target: plan of ${SIMULATIONS.toLocaleString('en-US')} studies over a 7-point grid with ${r.regression} under ${PLAN_TARGET_SECONDS} s: ${r.seconds.toFixed(1)} s on one thread ${r.seconds < PLAN_TARGET_SECONDS ? 'met' : 'NOT met'}, ${r.twoThreadSeconds.toFixed(1)} s on two ${r.twoThreadSeconds < PLAN_TARGET_SECONDS && r.sameFigures ? 'met' : 'NOT met'}`),
  ].join('\n');
}
