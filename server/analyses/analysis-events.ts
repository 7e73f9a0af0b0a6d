import { EventEmitter } from 'node:events';
import { sql } from 'drizzle-orm';
import { Client } from 'pg';
import type { Executor } from '../db/client';
import { logFailure } from '../log';

/** PostgreSQL channels: a job was queued (wakes the workers); an analysis changed state or progress. */
export const JOBS_CHANNEL = 'parallax_jobs';
export const STATE_CHANNEL = 'parallax_analysis';

export interface AnalysisChange { id: number; studyId: number; state: string; progress: number }

/** Tells every process listening that an analysis changed (delivered when the caller's transaction commits). */
export async function announceChange(db: Executor, change: AnalysisChange): Promise<void> {
  await db.execute(sql`SELECT pg_notify(${STATE_CHANNEL}, ${JSON.stringify(change)})`);
}

/** Tells every worker that a job is waiting (outside a transaction: at once). */
export async function announceJob(db: Executor): Promise<void> {
  await db.execute(sql`SELECT pg_notify(${JOBS_CHANNEL}, '')`);
}

/**
 * One dedicated connection per process that LISTENs on both channels and re-emits what arrives: 'job'
 * (a job was queued somewhere) and 'change' (an analysis's state or progress, for the pages following it).
 * A lost connection is opened again after a pause; meanwhile the workers' polling and the pages' polling
 * fallback keep everything moving, only less promptly.
 */
export class AnalysisEvents extends EventEmitter {
  private client: Client | null = null;
  private stopped = false;
  private retry: NodeJS.Timeout | null = null;
  private ready: Promise<void> | null = null;

  constructor(private readonly url: string) {
    super();
    this.setMaxListeners(0);
  }

  start(): Promise<void> {
    this.stopped = false;
    this.ready ??= this.connect();
    return this.ready;
  }

  /** True while the LISTEN connection is open (the page falls back to polling otherwise). */
  get listening(): boolean {
    return this.client !== null;
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.url, application_name: 'parallax-events', connectionTimeoutMillis: 2000 });
    const lost = (err?: Error) => {
      if (err) logFailure('the analysis event connection', err);
      if (this.client !== client) return;
      this.client = null;
      client.removeAllListeners();
      client.end().catch(() => undefined);
      this.later();
    };
    try {
      await client.connect();
      client.on('error', lost);
      client.on('end', () => lost());
      client.on('notification', (n) => {
        if (n.channel === JOBS_CHANNEL) this.emit('job');
        else if (n.channel === STATE_CHANNEL && n.payload) {
          try {
            this.emit('change', JSON.parse(n.payload) as AnalysisChange);
          } catch (err) {
            logFailure('an analysis event', err);
          }
        }
      });
      await client.query(`LISTEN ${JOBS_CHANNEL}`);
      await client.query(`LISTEN ${STATE_CHANNEL}`);
      if (this.stopped) {
        await client.end();
        return;
      }
      this.client = client;
      // Anything may have happened while no connection listened: followers re-read their analysis.
      this.emit('reconnected');
    } catch (err) {
      logFailure('opening the analysis event connection', err);
      client.removeAllListeners();
      client.end().catch(() => undefined);
      this.later();
    }
  }

  private later(): void {
    if (this.stopped || this.retry) return;
    this.retry = setTimeout(() => {
      this.retry = null;
      this.ready = this.connect();
    }, 1000);
    this.retry.unref();
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.retry) clearTimeout(this.retry);
    this.retry = null;
    await this.ready?.catch(() => undefined);
    const client = this.client;
    this.client = null;
    this.ready = null;
    if (client) {
      client.removeAllListeners();
      await client.end().catch(() => undefined);
    }
  }
}
