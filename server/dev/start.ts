import { loadConfig } from '../config';
import { migrateDatabase, openDatabase } from '../db/client';
import { demoSignIns, seedDemo } from '../db/seed';
import { DEMO_PASSWORD } from '../db/seed-data';
import { startFakeSmtp } from '../mail/fake-smtp';
import { keepRunningOnStrayRejections, listen } from '../main';
import { buildClient } from './client-build';
import { prepareDatabase } from './database';
import { log } from './run';

/** `npm start`: database, migrations, demo data, client build, local mail, then the app. */
export async function main(): Promise<void> {
  keepRunningOnStrayRejections();
  const database = await prepareDatabase('parallax', false);
  const cleanups: (() => Promise<void> | void)[] = [database.stopServer];
  const shutdown = async (code: number) => {
    for (const c of cleanups.reverse()) await Promise.resolve(c()).catch((e) => log(`shutdown: ${(e as Error).message}`));
    process.exit(code);
  };
  process.once('SIGINT', () => void shutdown(0));
  process.once('SIGTERM', () => void shutdown(0));
  try {
    await migrateDatabase(database.url);
    const seedDb = openDatabase(database.url, 2);
    cleanups.push(seedDb.close);
    await seedDemo(seedDb.db, process.env.PUBLIC_URL ?? `http://${process.env.HOST ?? "127.0.0.1"}:${process.env.PORT ?? 3000}`);
    log('migrations applied; demo laboratory ready');
    if (!(await buildClient())) throw new Error('the client did not build; see the messages above');
    const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: database.url };
    if (!env.SMTP_URL) {
      const smtp = await startFakeSmtp(seedDb.db, Number(process.env.SMTP_PORT ?? 0));
      cleanups.push(smtp.close);
      env.SMTP_URL = smtp.url;
      log(`local mail store listening at ${smtp.url} (messages appear on Admin › Mailbox)`);
    }
    const app = await listen(loadConfig(env));
    cleanups.push(app.close);
    console.log(`\n  Parallax is running at ${app.url}`);
    console.log(`  Database: ${database.url} (extra analysis workers: DATABASE_URL=... npm run worker)\n`);
    console.log(`  Demo sign-ins (demo only; password "${DEMO_PASSWORD}"):`);
    for (const line of demoSignIns()) console.log(`    ${line}`);
    console.log('\n  Press Ctrl-C to stop the app and the database it started.\n');
  } catch (err) {
    log((err as Error).message);
    await shutdown(1);
  }
}
