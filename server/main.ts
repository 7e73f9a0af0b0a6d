import type { Server } from 'node:http';
import { createApp } from './app';
import { scheduleCheckpoints } from './audit/checkpoints';
import { loadConfig, type Config } from './config';
import { scheduleDueReminders } from './releases/due.service';
import { openDatabase } from './db/client';
import { logFailure } from './log';
import { backfillInputHashes } from './specimens/input-hash';

export interface RunningApp { url: string; close: () => Promise<void> }

/** Listens on the configured port; close() drains connections, stops mail delivery and the pool. */
export async function listen(config: Config): Promise<RunningApp> {
  const database = openDatabase(config.databaseUrl);
  const { app, ctx } = createApp(config, database);
  ctx.mail.start();
  await ctx.jobs.start();
  const stopCheckpoints = scheduleCheckpoints(database.db);
  const stopReminders = scheduleDueReminders(database.db, config.publicUrl, () => ctx.mail.kick());
  // Studies from before input hashes were kept get theirs now, in the background (reads compute any still missing).
  void backfillInputHashes(database.db).catch((err) => logFailure('filling in input hashes', err));
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  return {
    url: `http://${config.host}:${port}`,
    close: async () => {
      stopCheckpoints();
      stopReminders();
      await ctx.mail.stop();
      await ctx.jobs.stop();
      const closed = new Promise<void>((r) => server.close(() => r()));
      server.closeAllConnections();
      await closed;
      await database.close();
    },
  };
}

/**
 * A promise nobody waited for (a library's background step while the database was away) is logged,
 * not allowed to end the process: the app keeps serving and answers 503 until the database is back.
 */
export function keepRunningOnStrayRejections(): void {
  process.on('unhandledRejection', (reason) => logFailure('a background step', reason));
}

if (require.main === module) {
  keepRunningOnStrayRejections();
  const config = loadConfig();
  listen(config).then((running) => {
    console.log(`[parallax] serving ${running.url}`);
    const stop = () => running.close().then(() => process.exit(0));
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
  });
}
