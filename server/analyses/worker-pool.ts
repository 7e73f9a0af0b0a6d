import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { AnalysisInput } from '../specimens/input-hash';

/** A pool of worker threads that run shared/stats, so the API thread stays responsive. */
export class AnalysisPool {
  private readonly pool: Piscina;
  /** By default one thread per core but one, at least one and at most four: the API thread keeps a core. */
  constructor(readonly threads = Math.max(1, Math.min(4, os.availableParallelism() - 1))) {
    this.pool = new Piscina({ filename: path.join(__dirname, 'analysis-task.js'), minThreads: 0, maxThreads: threads, idleTimeout: 30_000 });
  }

  async run(input: AnalysisInput, onProgress: (f: number) => void): Promise<unknown> {
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (f: number) => onProgress(f));
    try {
      return await this.pool.run({ input, port: port2 }, { transferList: [port2] });
    } finally {
      port1.close();
    }
  }

  close(): Promise<void> {
    return this.pool.destroy();
  }
}
