import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import type { AnalysisInput } from '../specimens/input-hash';
import type { PlanInput } from '../plans/plan-input';

/** A small invented comparison (30 pairs, few resamples) that exercises the engine's code paths. */
const WARM_UP_INPUT: AnalysisInput = {
  kind: methodComparisonMeta.kind,
  settings: { resamples: 1000, regressionResamples: 1000, seed: 'warm-up', decisionLevels: [5] },
  rows: Array.from({ length: 30 }, (_, i) => {
    const x = 1 + i * 0.3;
    const y = Math.round((x * 1.03 + ((i * 7) % 5) * 0.04) * 100) / 100;
    return {
      position: i + 1, label: `W${i + 1}`, comparative: x, candidate: y, value: null,
      comparativeText: x.toFixed(2), candidateText: y.toFixed(2), valueText: null, sex: null, ageBand: null, excluded: false, exclusionReason: null,
    };
  }),
};

/** The file each thread loads: the engine's task. */
export const ANALYSIS_TASK = path.join(__dirname, 'analysis-task.js');

/** A pool of worker threads that run shared/stats, so the API thread stays responsive. */
export class AnalysisPool {
  private readonly pool: Piscina;
  /**
   * By default one thread per core but one, at least one and at most four: the API thread keeps a core.
   * `taskFile` is for tests only (a task that throws or whose thread dies, server/analyses/testing/); the app
   * and the worker process always use the engine's task.
   */
  constructor(readonly threads = Math.max(1, Math.min(4, os.availableParallelism() - 1)), taskFile = ANALYSIS_TASK) {
    this.pool = new Piscina({ filename: taskFile, minThreads: threads, maxThreads: threads, idleTimeout: 30_000 });
  }

  async run(input: AnalysisInput | PlanInput, onProgress: (f: number) => void): Promise<unknown> {
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (f: number) => onProgress(f));
    try {
      return await this.pool.run({ input, port: port2 }, { transferList: [port2] });
    } finally {
      port1.close();
    }
  }

  /**
   * Loads the engine in every thread and runs a small analysis there (its code compiled and optimised),
   * so the first analysis a user asks for is not slowed by start-up. Results are thrown away.
   */
  async warmUp(): Promise<void> {
    try {
      await Promise.all(Array.from({ length: this.threads }, () => this.run(WARM_UP_INPUT, () => {})));
    } catch (err) {
      if (!this.closing) throw err;
    }
  }

  private closing = false;

  close(): Promise<void> {
    this.closing = true;
    return this.pool.destroy();
  }
}
