/**
 * `npm run load [-- --users 50 --seconds 20 --studies 5000 --big 40 --against DIR --json]`
 *
 * Reads at laboratory-network scale, on loopback only, bounded in time. It builds a throwaway database on
 * the local PostgreSQL (migrations, the demo laboratory, then `--studies` more comparison studies of 40–120
 * pairs, `--big` of them with 2,000 pairs, each with a finished analysis), starts the API as its own process
 * (as `npm start` runs it), signs in `--users` people, and drives it with autocannon:
 *   1. each read route alone (one connection, a few seconds): p50/p95/p99;
 *   2. all users at once for `--seconds`, each cycling worklist → studies list → a study → its history,
 *      once as fast as answers come (a closed loop) and once paced at two requests a second per user:
 *      requests/s and p50/p95/p99 per route, and every status other than 200;
 *   3. analyses of a 120-pair study, one after another: POST to done (the state as stored, read every
 *      10 ms) and, where the server pushes events, click to findings (POST, the pushed "done", the results
 *      read), the first after start apart; the API's event-loop delay while they run (health report).
 * `--against DIR` first measures the API of another checkout (an older commit, with this node_modules
 * linked into it) on the same database, so before and after are measured in one run. The database is
 * dropped at the end. Figures depend on the machine: the README gives those of the project's 2-core one.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { eq, sql } from 'drizzle-orm';
import { migrateDatabase, openDatabase, type Database } from '../db/client';
import { analytes, instruments, laboratories, studies, users } from '../db/schema';
import { seedDemo } from '../db/seed';
import { DEMO_PASSWORD } from '../db/seed-data';
import { prepareDatabase } from '../dev/database';
import { runAnalysis } from '../analyses/run-analysis';
import { analysisInput, backfillInputHashes } from '../specimens/input-hash';
import { ENGINE_VERSION } from '@shared/stats/engine';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (opts: object) => AutocannonInstance;
interface AutocannonInstance extends Promise<{ requests: { total: number }; duration: number; non2xx: number; errors: number; timeouts: number }> {
  on(event: 'response', fn: (client: object, status: number, bytes: number, ms: number) => void): void;
  stop(): void;
}

const ROOT = path.resolve(__dirname, '../..');
const LIMIT_MINUTES = 25;
/** The paced phase: each user asks this often (a page every second is a busy reader; the closed loop asks as fast as answers come). */
const PACED_PER_SECOND = 2;

interface Options { users: number; seconds: number; studies: number; big: number; against: string | null; json: boolean; analyses: number }

function options(argv: string[]): Options {
  const value = (name: string, fallback: number) => {
    const k = argv.indexOf(`--${name}`);
    if (k < 0) return fallback;
    const v = Number(argv[k + 1]);
    if (!Number.isInteger(v) || v < 1) throw new Error(`--${name} takes a whole number above 0 (got ${argv[k + 1] ?? 'nothing'})`);
    return v;
  };
  const k = argv.indexOf('--against');
  return {
    users: value('users', 50), seconds: value('seconds', 20), studies: value('studies', 5000), big: value('big', 40), analyses: value('analyses', 15),
    against: k >= 0 ? path.resolve(argv[k + 1] ?? '') : null, json: argv.includes('--json'),
  };
}

const log = (line: string) => process.stderr.write(`[load] ${line}\n`);

// ---------------------------------------------------------------- the laboratory

export interface Lab { studyIds: number[]; bigIds: number[]; emails: string[]; analyteId: number; lineIds: number[] }

export async function seedLaboratory(db: Database, o: Options): Promise<Lab> {
  const [lab] = await db.select().from(laboratories).limit(1);
  const [glucose] = await db.select().from(analytes).where(eq(analytes.name, 'Glucose'));
  const lines = (await db.select().from(instruments).where(eq(instruments.laboratoryId, lab.id))).sort((a, b) => a.id - b.id);
  const [template] = await db.select().from(studies).where(eq(studies.analyteId, glucose.id)).limit(1);
  const hash = bcrypt.hashSync(DEMO_PASSWORD, 10);
  const emails = Array.from({ length: o.users }, (_, i) => `load${String(i + 1).padStart(3, '0')}@valeharbor.example`);
  const people = await db.insert(users).values(emails.map((email, i) => ({
    laboratoryId: lab.id, name: `Load user ${i + 1}`, email, passwordHash: hash, roles: i % 2 ? ['technologist'] : ['technologist', 'director'],
  }))).returning({ id: users.id });
  const ids = `{${people.map((p) => p.id).join(',')}}`;
  const settings = JSON.stringify({ ...(template.settings as object), resamples: 2000, regressionResamples: 1000 });
  const { rows } = await db.execute<{ id: number }>(sql`
    INSERT INTO studies (laboratory_id, kind, title, purpose, analyte_id, comparative_instrument_id, candidate_instrument_id, settings, created_by, created_at, updated_at)
    SELECT ${lab.id}, 'method-comparison', 'Glucose verification ' || g, 'Invented load-test study', ${glucose.id}, ${lines[0].id}, ${lines[1].id},
           ${settings}::jsonb, (${ids}::int[])[1 + g % ${o.users}], now() - make_interval(hours => g), now() - make_interval(hours => g)
      FROM generate_series(1, ${o.studies}) g
    RETURNING id`);
  const studyIds = rows.map((r) => r.id).sort((a, b) => a - b);
  const every = Math.max(1, Math.floor(o.studies / o.big));
  const bigIds = studyIds.filter((_, i) => i % every === 0).slice(0, o.big);
  log(`${studyIds.length} studies; adding rows (${bigIds.length} of 2,000 pairs, the others 40–120)`);
  const big = `{${bigIds.join(',')}}`;
  for (let from = 0; from < studyIds.length; from += 500) {
    const part = `{${studyIds.slice(from, from + 500).join(',')}}`;
    await db.execute(sql`
      INSERT INTO specimens (study_id, position, label, comparative, candidate, comparative_text, candidate_text, entered_by)
      SELECT s.id, p, 'S' || lpad(p::text, 4, '0'), v.x, v.y, v.x::text, v.y::text, s.created_by
        FROM studies s
        CROSS JOIN LATERAL generate_series(1, CASE WHEN s.id = ANY(${big}::int[]) THEN 2000 ELSE 40 + s.id % 81 END) p
        CROSS JOIN LATERAL (SELECT round((3 + ((p * 7919 + s.id * 31) % 1700) / 100.0)::numeric, 1) AS x) b
        CROSS JOIN LATERAL (SELECT b.x AS x, round((b.x * 1.02 + 0.1 + ((p * 37 + s.id) % 11 - 5) * 0.02)::numeric, 1) AS y) v
       WHERE s.id = ANY(${part}::int[])`);
  }
  let started = Date.now();
  const hashed = await backfillInputHashes(db);
  log(`input hashes of ${hashed} studies in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  started = Date.now();
  for (const kind of ['big', 'small'] as const) {
    const sample = kind === 'big' ? bigIds[0] : studyIds.find((id) => !bigIds.includes(id))!;
    const [study] = await db.select().from(studies).where(eq(studies.id, sample));
    const input = await analysisInput(db, study);
    const results = runAnalysis(input);
    const which = kind === 'big' ? sql`s.id = ANY(${big}::int[])` : sql`NOT (s.id = ANY(${big}::int[]))`;
    await db.execute(sql`
      INSERT INTO analyses (study_id, state, progress, input_hash, input, engine_version, seed, resamples, results, requested_by, created_at, started_at, finished_at, duration_ms)
      SELECT s.id, 'done', 1, s.input_hash, ${JSON.stringify(input)}::jsonb, ${ENGINE_VERSION}, 'load', 2000, ${JSON.stringify(results)}::jsonb, s.created_by, s.updated_at, s.updated_at, s.updated_at, 100
        FROM studies s WHERE s.laboratory_id = ${lab.id} AND ${which} AND s.title LIKE 'Glucose verification %'`);
  }
  log(`analyses in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  await db.execute(sql`UPDATE studies SET state = 'awaiting-signoff', submitted_at = updated_at WHERE id = ANY(${`{${studyIds.filter((id) => id % 10 === 3).join(',')}}`}::int[])`);
  await db.execute(sql`UPDATE studies SET state = 'signed', submitted_at = updated_at, signed_at = updated_at WHERE id = ANY(${`{${studyIds.filter((id) => id % 5 === 0).join(',')}}`}::int[])`);
  await db.execute(sql`ANALYZE`);
  return { studyIds, bigIds, emails, analyteId: glucose.id, lineIds: lines.map((l) => l.id) };
}

// ---------------------------------------------------------------- the API under load

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });
}

export async function startApi(tree: string, databaseUrl: string): Promise<{ url: string; child: ChildProcess }> {
  const port = await freePort();
  const child = spawn(process.execPath, [require.resolve('tsx/cli'), path.join(tree, 'server/main.ts')], {
    cwd: tree, stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), HOST: '127.0.0.1', SIGN_IN_RATE_LIMIT: '100000', SMTP_URL: 'smtp://127.0.0.1:9' },
  });
  let said = '';
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the API in ${tree} did not start within 60 s: ${said.slice(-500)}`)), 60_000);
    const listen = (chunk: Buffer) => {
      said += chunk.toString();
      if (said.includes('serving http')) { clearTimeout(timer); resolve(); }
    };
    child.stdout!.on('data', listen);
    child.stderr!.on('data', listen);
    child.once('exit', (code) => { clearTimeout(timer); reject(new Error(`the API in ${tree} stopped (${code}): ${said.slice(-500)}`)); });
  });
  await ready;
  return { url: `http://127.0.0.1:${port}`, child };
}

export function stopApi(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
    setTimeout(() => child.kill('SIGKILL'), 10_000).unref();
  });
}

export async function signIn(url: string, email: string): Promise<{ cookie: string; xsrf: string }> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const k = pair.indexOf('=');
      jar.set(pair.slice(0, k), pair.slice(k + 1));
    }
  };
  keep(await fetch(`${url}/api/v1/session`));
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const xsrf = decodeURIComponent(jar.get('XSRF-TOKEN') ?? '');
  const res = await fetch(`${url}/api/v1/session`, {
    method: 'POST', headers: { 'content-type': 'application/json', cookie: cookie(), 'x-xsrf-token': xsrf }, body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${await res.text()}`);
  keep(res);
  return { cookie: cookie(), xsrf: decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') };
}

interface RouteFigures { route: string; requests: number; perSecond: number; p50: number; p95: number; p99: number; notOk: Record<string, number> }

const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN);
const round1 = (v: number) => Math.round(v * 10) / 10;

interface Route { name: string; path: () => string }

export function routes(lab: Lab): Route[] {
  let k = 0;
  // Half the studies opened are the 2,000-pair ones, half the others (a deterministic walk).
  const study = () => {
    k++;
    return k % 2 ? lab.bigIds[(k >> 1) % lab.bigIds.length] : lab.studyIds[(k * 7919) % lab.studyIds.length];
  };
  return [
    { name: 'worklist', path: () => '/api/v1/worklist' },
    { name: 'studies list', path: () => `/api/v1/studies?page=${1 + (k++ % 5)}&pageSize=25` },
    { name: 'a study', path: () => `/api/v1/studies/${study()}` },
    { name: 'its history', path: () => `/api/v1/studies/${study()}/history` },
  ];
}

/** autocannon over the given routes, each connection cycling through them in order with its own sign-in. */
export async function drive(url: string, list: Route[], cookies: string[], connections: number, seconds: number, perUserPerSecond?: number): Promise<{ figures: RouteFigures[]; total: number; perSecond: number }> {
  let nextCookie = 0;
  const requests = list.map((r) => ({
    method: 'GET',
    setupRequest: (req: { headers?: Record<string, string> }, context: { cookie?: string }) => {
      context.cookie ??= cookies[nextCookie++ % cookies.length];
      return { ...req, path: r.path(), headers: { ...(req.headers ?? {}), cookie: context.cookie } };
    },
  }));
  const times: number[][] = list.map(() => []);
  const notOk: Record<string, number>[] = list.map(() => ({}));
  const seen = new WeakMap<object, number>();
  const instance = autocannon({ url, connections, duration: seconds, requests, timeout: 60, ...(perUserPerSecond ? { connectionRate: perUserPerSecond } : {}) });
  instance.on('response', (client, status, _bytes, ms) => {
    const k = seen.get(client) ?? 0;
    seen.set(client, k + 1);
    const at = k % list.length;
    times[at].push(ms);
    if (status !== 200) notOk[at][status] = (notOk[at][status] ?? 0) + 1;
  });
  const result = await instance;
  const figures = list.map((r, i) => {
    const sorted = times[i].sort((a, b) => a - b);
    return { route: r.name, requests: sorted.length, perSecond: round1(sorted.length / seconds), p50: round1(percentile(sorted, 50)), p95: round1(percentile(sorted, 95)), p99: round1(percentile(sorted, 99)), notOk: notOk[i] };
  });
  if (result.errors || result.timeouts) log(`${result.errors} connection errors, ${result.timeouts} timeouts`);
  return { figures, total: result.requests.total, perSecond: round1(result.requests.total / seconds) };
}

interface AnalysisFigures { rounds: number; firstMs: number; untilDone: { p50: number; p95: number }; clickToFindings: { p50: number; p95: number } | null; eventLoop: { p99: number; max: number } | null }

/** Reads server-sent events until an event of the analysis says it is done; resolves with the time then. */
async function pushedDone(url: string, cookie: string, id: number): Promise<number | null> {
  const res = await fetch(`${url}/api/v1/analyses/${id}/events`, { headers: { cookie, accept: 'text/event-stream' } });
  if (res.status !== 200 || !res.body) return null;
  const reader = res.body.getReader();
  const decoder = new TextDecoder();
  let text = '';
  for (;;) {
    const { value, done } = await reader.read();
    if (done) return null;
    text += decoder.decode(value, { stream: true });
    if (/"state":"(done|failed)"/.test(text)) {
      const at = performance.now();
      await reader.cancel().catch(() => undefined);
      return at;
    }
  }
}

/** A new draft comparison of 120 invented glucose pairs, entered through the API. */
async function timingStudy(url: string, lab: Lab, session: { cookie: string; xsrf: string }): Promise<number> {
  const headers = { 'content-type': 'application/json', cookie: session.cookie, 'x-xsrf-token': session.xsrf };
  const created = await fetch(`${url}/api/v1/studies`, { method: 'POST', headers, body: JSON.stringify({ kind: 'method-comparison', title: `Timing ${Date.now()}`, analyteId: lab.analyteId, comparativeInstrumentId: lab.lineIds[0], candidateInstrumentId: lab.lineIds[1] }) });
  const study = await created.json() as { id: number; version: number };
  if (created.status !== 201) throw new Error(`creating the timing study answered ${created.status}: ${JSON.stringify(study)}`);
  const rows = Array.from({ length: 120 }, (_, i) => {
    const x = 3 + ((i * 7919) % 1700) / 100;
    return { label: `T${i + 1}`, comparative: x.toFixed(1), candidate: (x * 1.02 + 0.1 + (((i * 37) % 11) - 5) * 0.02).toFixed(1) };
  });
  const put = await fetch(`${url}/api/v1/studies/${study.id}/specimens`, { method: 'PUT', headers, body: JSON.stringify({ version: study.version, rows }) });
  if (put.status !== 200) throw new Error(`entering the timing rows answered ${put.status}: ${await put.text()}`);
  return study.id;
}

async function analyses(url: string, lab: Lab, session: { cookie: string; xsrf: string }, rounds: number): Promise<AnalysisFigures> {
  const headers = { 'content-type': 'application/json', cookie: session.cookie, 'x-xsrf-token': session.xsrf };
  const study = { id: await timingStudy(url, lab, session) };
  await fetch(`${url}/api/v1/health`);
  const untilDone: number[] = [];
  const clickToFindings: number[] = [];
  let pushes = true;
  let firstMs = NaN;
  for (let r = 0; r < rounds + 1; r++) {
    const click = performance.now();
    const posted = await fetch(`${url}/api/v1/studies/${study.id}/analyses`, { method: 'POST', headers, body: '{}' });
    const { id } = await posted.json() as { id: number };
    if (posted.status !== 202) throw new Error(`queueing an analysis answered ${posted.status}`);
    const pushed = pushes ? pushedDone(url, session.cookie, id) : Promise.resolve(null);
    let done = NaN;
    for (;;) {
      const a = await (await fetch(`${url}/api/v1/analyses/${id}`, { headers: { cookie: session.cookie } })).json() as { state: string; error: string | null };
      if (a.state === 'done' || a.state === 'failed') {
        if (a.state === 'failed') throw new Error(`the timing analysis failed: ${a.error}`);
        done = performance.now();
        break;
      }
      await new Promise((res) => setTimeout(res, 10));
    }
    const pushedAt = await pushed;
    if (pushedAt === null) pushes = false;
    else {
      await (await fetch(`${url}/api/v1/analyses/${id}`, { headers: { cookie: session.cookie } })).json();
      await (await fetch(`${url}/api/v1/studies/${study.id}`, { headers: { cookie: session.cookie } })).json();
      if (r > 0) clickToFindings.push(performance.now() - click);
    }
    if (r === 0) firstMs = done - click;
    else untilDone.push(done - click);
  }
  const health = await (await fetch(`${url}/api/v1/health`)).json() as { eventLoopDelayMs?: { p99: number; max: number } };
  const sorted = (v: number[]) => [...v].sort((a, b) => a - b);
  const pick = (v: number[]) => ({ p50: round1(percentile(sorted(v), 50)), p95: round1(percentile(sorted(v), 95)) });
  return {
    rounds, firstMs: round1(firstMs), untilDone: pick(untilDone), clickToFindings: pushes && clickToFindings.length ? pick(clickToFindings) : null,
    eventLoop: health.eventLoopDelayMs ? { p99: health.eventLoopDelayMs.p99, max: health.eventLoopDelayMs.max } : null,
  };
}

/**
 * In Chromium (Debian's, driven by Playwright), where the checkout has a built client: a new study of 120
 * pairs each round, its Findings tab opened, then the time from the click on "Run" to the findings drawn.
 */
async function pageTimings(tree: string, url: string, lab: Lab, session: { cookie: string; xsrf: string }, rounds: number): Promise<{ p50: number; p95: number; firstMs: number } | null> {
  const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (!existsSync(path.join(tree, 'dist/client/browser/index.html')) || !existsSync(chromiumPath)) return null;
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const { chromium } = require('@playwright/test') as typeof import('@playwright/test');
  const browser = await chromium.launch({
    executablePath: chromiumPath,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1366, height: 768 } });
    await page.goto(`${url}/sign-in`);
    await page.getByTestId('email').fill(lab.emails[0]);
    await page.getByTestId('password').fill(DEMO_PASSWORD);
    await page.getByTestId('sign-in').click();
    await page.getByTestId('welcome').waitFor();
    const times: number[] = [];
    for (let r = 0; r < rounds + 1; r++) {
      const id = await timingStudy(url, lab, session);
      await page.goto(`${url}/studies/${id}/findings`);
      const run = page.getByTestId('run-analysis');
      await run.waitFor();
      const click = performance.now();
      await run.click();
      await page.getByTestId('verdict-panel').waitFor({ state: 'visible', timeout: 60_000 });
      times.push(performance.now() - click);
    }
    const [first, ...rest] = times;
    const sorted = rest.sort((a, b) => a - b);
    return { p50: round1(percentile(sorted, 50)), p95: round1(percentile(sorted, 95)), firstMs: round1(first) };
  } finally {
    await browser.close();
  }
}

interface Measured { tree: string; alone: RouteFigures[]; mix: { figures: RouteFigures[]; total: number; perSecond: number }; paced: { figures: RouteFigures[]; total: number; perSecond: number }; analyses: AnalysisFigures | null; page: { p50: number; p95: number; firstMs: number } | null }

async function measure(tree: string, databaseUrl: string, lab: Lab, o: Options): Promise<Measured> {
  log(`starting the API of ${tree}`);
  const api = await startApi(tree, databaseUrl);
  try {
    const sessions = [];
    for (const email of lab.emails) sessions.push(await signIn(api.url, email));
    const cookies = sessions.map((s) => s.cookie);
    const list = routes(lab);
    await drive(api.url, list, cookies, 4, 2);
    const alone: RouteFigures[] = [];
    for (const r of list) {
      log(`  ${r.name} alone`);
      alone.push((await drive(api.url, [r], cookies.slice(0, 1), 1, 4)).figures[0]);
    }
    log(`  ${o.users} users for ${o.seconds} s`);
    const mix = await drive(api.url, list, cookies, o.users, o.seconds);
    log(`  ${o.users} users for ${o.seconds} s, each asking ${PACED_PER_SECOND} times a second`);
    const paced = await drive(api.url, list, cookies, o.users, o.seconds, PACED_PER_SECOND);
    log(`  ${o.analyses} analyses of 120 pairs`);
    const failed = (what: string) => (err: unknown) => {
      log(`  ${what} failed: ${(err as Error).message}`);
      return null;
    };
    const timing = await analyses(api.url, lab, sessions[0], o.analyses).catch(failed('the analyses'));
    log('  the page in Chromium: click on Run to findings drawn');
    const page = timing ? await pageTimings(tree, api.url, lab, sessions[0], Math.min(o.analyses, 8)).catch(failed('the page')) : null;
    return { tree, alone, mix, paced, analyses: timing, page };
  } finally {
    await stopApi(api.child);
  }
}

// ---------------------------------------------------------------- report

function report(all: Measured[], o: Options, seeded: string): string {
  const out: string[] = [`Parallax load: ${seeded}; ${o.users} users for ${o.seconds} s on 127.0.0.1`, ''];
  for (const m of all) {
    out.push(`API of ${m.tree}`);
    out.push('  route          alone p50/p95/p99 ms     all users: req/s  p50/p95/p99 ms       not 200');
    for (let i = 0; i < m.alone.length; i++) {
      const a = m.alone[i];
      const b = m.mix.figures[i];
      const bad = Object.entries(b.notOk).map(([s, n]) => `${n}×${s}`).join(' ') || 'none';
      out.push(`  ${a.route.padEnd(14)} ${`${a.p50} / ${a.p95} / ${a.p99}`.padEnd(24)} ${String(b.perSecond).padStart(16)}  ${`${b.p50} / ${b.p95} / ${b.p99}`.padEnd(20)} ${bad}`);
    }
    const all95 = Math.max(...m.mix.figures.map((f) => f.p95));
    const errors = m.mix.figures.reduce((s, f) => s + Object.entries(f.notOk).filter(([st]) => Number(st) >= 500).reduce((t, [, n]) => t + n, 0), 0);
    out.push(`  all routes: ${m.mix.perSecond} requests/s; worst route p95 ${all95} ms; ${errors} answers 5xx`);
    const p95 = Math.max(...m.paced.figures.map((f) => f.p95));
    const p99 = Math.max(...m.paced.figures.map((f) => f.p99));
    const pacedErrors = m.paced.figures.reduce((t, f) => t + Object.entries(f.notOk).filter(([st]) => Number(st) >= 500).reduce((u, [, k]) => u + k, 0), 0);
    out.push(`  paced, each user ${PACED_PER_SECOND} requests a second: ${m.paced.perSecond} requests/s; ${m.paced.figures.map((f) => `${f.route} p95 ${f.p95}`).join(', ')}; worst p95 ${p95} ms, p99 ${p99} ms; ${pacedErrors} answers 5xx`);
    const a = m.analyses;
    if (!a) {
      out.push('  analyses: not measured (see the log above)', '');
      continue;
    }
    out.push(`  analysis of 120 pairs: first after start ${a.firstMs} ms; then POST to done p50 ${a.untilDone.p50} ms, p95 ${a.untilDone.p95} ms (${a.rounds} runs)`);
    out.push(a.clickToFindings ? `  click to findings (POST, pushed "done", results and study read): p50 ${a.clickToFindings.p50} ms, p95 ${a.clickToFindings.p95} ms` : '  click to findings: this API pushes no events');
    out.push(m.page ? `  the page in Chromium, click on Run to findings drawn (120 pairs): p50 ${m.page.p50} ms, p95 ${m.page.p95} ms (first ${m.page.firstMs} ms)` : '  the page: not measured (no built client in this checkout, or no Chromium)');
    out.push(a.eventLoop ? `  API event-loop delay while analyses ran: p99 ${a.eventLoop.p99} ms, max ${a.eventLoop.max} ms` : '  API event-loop delay: not reported by this API');
    out.push('');
  }
  return out.join('\n');
}

export async function main(argv: string[]): Promise<void> {
  const o = options(argv);
  const watchdog = setTimeout(() => { log(`stopped after ${LIMIT_MINUTES} minutes`); process.exit(2); }, LIMIT_MINUTES * 60_000);
  watchdog.unref();
  const database = await prepareDatabase(`parallax_load_${Date.now().toString(36)}`, true);
  const db = openDatabase(database.url, 4);
  try {
    log(`throwaway database ${database.url}`);
    await migrateDatabase(database.url);
    await seedDemo(db.db, 'http://127.0.0.1');
    const started = Date.now();
    const lab = await seedLaboratory(db.db, o);
    const seeded = `${lab.studyIds.length} studies (${lab.bigIds.length} of 2,000 pairs) seeded in ${((Date.now() - started) / 1000).toFixed(0)} s`;
    log(seeded);
    const all: Measured[] = [];
    for (const tree of o.against ? [o.against, ROOT] : [ROOT]) all.push(await measure(tree, database.url, lab, o));
    process.stdout.write(o.json ? `${JSON.stringify({ seeded, options: o, results: all })}\n` : `${report(all, o, seeded)}\n`);
  } catch (err) {
    // A failed query's message carries its parameters (whole rows): the database's own words are enough.
    const e = err as Error & { cause?: Error };
    throw new Error(e.cause?.message ?? e.message);
  } finally {
    await db.close();
    await database.drop();
    database.stopServer();
    clearTimeout(watchdog);
  }
}

if (require.main === module) {
  main(process.argv.slice(2)).catch((err) => {
    console.error(`[load] ${err?.cause?.message ?? (err instanceof Error ? err.message : err)}`);
    process.exit(1);
  });
}
