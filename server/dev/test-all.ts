import { existsSync, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from '../config';
import { migrateDatabase, openDatabase } from '../db/client';
import { seedDemo } from '../db/seed';
import { startFakeSmtp } from '../mail/fake-smtp';
import { listen } from '../main';
import { buildClient } from './client-build';
import { prepareDatabase } from './database';
import { choosePort } from './postgres';
import { ensureChromium } from './chromium';
import { readJest, readPlaywright, SuiteCount } from './suite-results';
import { log, runInherit } from './run';

const root = path.resolve(__dirname, '../..');
const out = path.join(root, '.test-output');
const bin = (name: string) => path.join(root, 'node_modules/.bin', name);

async function jestGroup(group: 'unit' | 'api', env: NodeJS.ProcessEnv): Promise<SuiteCount> {
  const file = path.join(out, `jest-${group}.json`);
  const args = ['-c', 'server/dev/jest.config.js', '--json', `--outputFile=${file}`, '--ci'];
  if (group === 'api') args.push('--runInBand');
  log(`jest: ${group} suites`);
  await runInherit(bin('jest'), args, { cwd: root, env: { ...env, PARALLAX_JEST_GROUP: group } });
  return readJest(group === 'unit' ? 'unit, statistics and reference checks' : 'API (supertest, PostgreSQL)', file);
}

async function e2e(databaseUrl: string, built: boolean, chromium: { ok: boolean; message: string }): Promise<SuiteCount> {
  if (!built) return { name: 'end-to-end (Chromium)', passed: 0, failed: 1, note: 'the client did not build' };
  if (!chromium.ok) return { name: 'end-to-end (Chromium)', passed: 0, failed: 1, note: chromium.message };
  const db = openDatabase(databaseUrl, 2);
  const smtp = await startFakeSmtp(db.db);
  // A real port, so the links the app e-mails (PUBLIC_URL) lead back to it.
  const port = await choosePort(Number(process.env.PARALLAX_E2E_PORT ?? 3900), true);
  const app = await listen(loadConfig({ ...process.env, DATABASE_URL: databaseUrl, SMTP_URL: smtp.url, PORT: String(port), PUBLIC_URL: '', SIGN_IN_RATE_LIMIT: '1000' }));
  try {
    log(`Playwright against ${app.url}`);
    await runInherit(bin('playwright'), ['test', '-c', 'e2e/playwright.config.ts'], {
      cwd: root,
      env: { ...process.env, PARALLAX_E2E_URL: app.url, DATABASE_URL: databaseUrl, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' },
    });
  } finally {
    await app.close();
    await smtp.close();
    await db.close();
  }
  return readPlaywright('end-to-end (Chromium)', path.join(out, 'e2e.json'));
}

/** The server, shared code and tests type-check (the client build checks the client). */
async function typeCheck(): Promise<SuiteCount> {
  log('type check: tsc -p tsconfig.server.json --noEmit');
  const code = await runInherit(bin('tsc'), ['-p', 'tsconfig.server.json', '--noEmit'], { cwd: root });
  return { name: 'server and shared type check', passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 };
}

/** `npm test`: a throwaway database, then every suite; ends with one line `tests: N passed, N failed`. */
export async function main(): Promise<void> {
  rmSync(out, { recursive: true, force: true });
  mkdirSync(path.join(out, 'screenshots'), { recursive: true });
  const database = await prepareDatabase(null, true);
  const counts: SuiteCount[] = [];
  try {
    await migrateDatabase(database.url);
    const seed = openDatabase(database.url, 2);
    await seedDemo(seed.db);
    await seed.close();
    const env = { ...process.env, DATABASE_URL: database.url, TZ: 'UTC' };
    // Before any suite: the API suites render PDF pages with poppler's pdftoppm, installed with Chromium.
    const chromium = ensureChromium();
    const built = existsSync(path.join(root, 'angular.json')) ? await buildClient() : false;
    counts.push({ name: 'client production build', passed: built ? 1 : 0, failed: built ? 0 : 1 });
    counts.push(await typeCheck());
    counts.push(await jestGroup('unit', env));
    counts.push(await jestGroup('api', env));
    counts.push(await e2e(database.url, built, chromium));
  } catch (err) {
    log(`the test run stopped: ${(err as Error).message}`);
    counts.push({ name: 'test preparation', passed: 0, failed: 1, note: (err as Error).message });
  } finally {
    await database.drop().catch((e) => log(`could not drop the test database: ${(e as Error).message}`));
    database.stopServer();
  }
  console.log('\nsuite results:');
  for (const c of counts) console.log(`  ${c.name.padEnd(40)} ${c.passed} passed, ${c.failed} failed${c.note ? ` (${c.note})` : ''}`);
  const passed = counts.reduce((a, c) => a + c.passed, 0);
  const failed = counts.reduce((a, c) => a + c.failed, 0);
  console.log(`tests: ${passed} passed, ${failed} failed`);
  process.exit(failed > 0 || passed === 0 ? 1 : 0);
}
