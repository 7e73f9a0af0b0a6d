import type { MessagePort } from 'node:worker_threads';
import type { AnalysisInput } from '../specimens/input-hash';
import type { PlanInput } from '../plans/plan-input';
import { runAnalysis } from './run-analysis';

/** The piscina task: runs one analysis off the main thread and posts progress on the port. */
export default function task({ input, port }: { input: AnalysisInput | PlanInput; port: MessagePort }): unknown {
  let last = 0;
  try {
    return runAnalysis(input, (f) => {
      const now = Date.now();
      if (now - last > 200 || f >= 1) {
        last = now;
        port.postMessage(f);
      }
    });
  } finally {
    port.close();
  }
}
