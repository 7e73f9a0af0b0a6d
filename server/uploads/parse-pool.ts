import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { AppError } from '../http/app-error';
import type { ParseResult } from './parse-task';
import { MESSAGES, UPLOAD_LIMITS } from './upload-limits';

export type ParsedUpload = Extract<ParseResult, { ok: true }>;

export interface ParsePoolOptions { timeMs: number; memoryMb: number }

const refused = (message: string) => new AppError('invalid_request', message, [{ path: 'file', message }]);

/**
 * Worker threads that read uploads, so a hostile or huge file never stalls the API thread. Each
 * worker has a heap limit, and each file a time budget from the moment its worker starts on it;
 * a file that runs out of either is a 400 that names the limit, and its worker is ended.
 */
export class UploadParser {
  private readonly pool: Piscina;

  constructor(private readonly options: ParsePoolOptions = { timeMs: UPLOAD_LIMITS.timeMs, memoryMb: UPLOAD_LIMITS.memoryMb }) {
    this.pool = new Piscina({
      filename: path.join(__dirname, 'parse-task.js'),
      // At least one thread: when a worker is ended (memory, time), piscina replaces it only up to
      // minThreads, and with none the files queued behind it would wait for the next upload.
      minThreads: 1,
      maxThreads: Math.max(1, Math.min(2, os.availableParallelism() - 1)),
      idleTimeout: 30_000,
      maxQueue: 16,
      // Lower the readers' scheduling priority (Linux, through piscina's optional @napi-rs/nice), so
      // on a busy machine the API thread and the database get the CPU first.
      niceIncrement: 10,
      resourceLimits: { maxOldGenerationSizeMb: options.memoryMb, maxYoungGenerationSizeMb: 16 },
    });
  }

  /**
   * Reads one file in a worker; resolves with the table, or rejects with an AppError a user can act on.
   * @param studyLabels the study's labels now: the worker checks each column's labels against them (label-checks.ts)
   */
  async parse(fileName: string, bytes: Buffer, studyLabels: string[] = []): Promise<ParsedUpload> {
    const { port1, port2 } = new MessageChannel();
    const abort = new AbortController();
    let timer: NodeJS.Timeout | undefined;
    port1.once('message', () => { timer = setTimeout(() => abort.abort(), this.options.timeMs); });
    const copy = new Uint8Array(bytes); // a copy of its own, so only the file (not a shared pool) is transferred
    let result: ParseResult;
    try {
      result = await this.pool.run({ fileName, bytes: copy, port: port2, studyLabels }, { transferList: [port2, copy.buffer], signal: abort.signal });
    } catch (err) {
      if (abort.signal.aborted) throw refused(MESSAGES.time(this.options.timeMs));
      if ((err as { code?: string }).code === 'ERR_WORKER_OUT_OF_MEMORY') throw refused(MESSAGES.memory(this.options.memoryMb));
      if (/queue is at limit/i.test((err as Error).message)) throw new AppError('too_many', MESSAGES.busy());
      throw err;
    } finally {
      clearTimeout(timer);
      port1.close();
    }
    if (!result.ok) throw refused(result.message);
    return result;
  }

  /** Ends the workers (tests; the server's own pool lives as long as the process). */
  close(): Promise<void> {
    return this.pool.destroy();
  }
}

let shared: UploadParser | undefined;
/** The process's one upload pool, made on first use; its idle worker never holds the process open. */
export const uploadParser = (): UploadParser => (shared ??= new UploadParser());
