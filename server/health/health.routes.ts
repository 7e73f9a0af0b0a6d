import { sql } from 'drizzle-orm';
import type { HealthReport } from '@shared/schemas';
import type { AppContext } from '../context';
import { RETRY_AFTER_SECONDS } from '../http/database-errors';
import { eventLoopDelaySinceLastReading } from './event-loop';
import type { RouteSpec } from '../http/routes';

/** Resolves with the check's outcome, or false after `ms` (a database that hangs must not hang the check). */
async function within(ms: number, check: () => Promise<unknown>): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<boolean>((resolve) => { timer = setTimeout(() => resolve(false), ms); });
  try {
    return await Promise.race([check().then(() => true, () => false), late]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * `GET /api/v1/health` for load balancers and monitors: no sign-in and no session (it runs before the
 * session store is read), 200 when the database and the job queue answer, 503 with Retry-After when not.
 */
export function healthRoutes(ctx: AppContext): RouteSpec[] {
  eventLoopDelaySinceLastReading();
  return [{
    method: 'get', path: '/health', access: 'public', sessionless: true,
    handler: async (_req, res) => {
      const [database, queue] = await Promise.all([
        within(1500, () => ctx.db.execute(sql`SELECT 1`)),
        within(1500, () => ctx.jobs.healthy()),
      ]);
      const report: HealthReport = {
        status: database && queue ? 'ok' : 'unavailable',
        database: database ? 'ok' : 'not answering',
        queue: queue ? 'ok' : 'not answering',
        checkedAt: new Date().toISOString(),
        eventLoopDelayMs: eventLoopDelaySinceLastReading(),
      };
      if (report.status !== 'ok') res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
      res.status(report.status === 'ok' ? 200 : 503).json(report);
    },
  }];
}
