import request from 'supertest';
import { analysedComparison } from './fixtures';
import type TestAgent from 'supertest/lib/agent';
import { createApp, CreatedApp } from '../app';
import { loadConfig } from '../config';
import { migrateDatabase, openDatabase, type Db } from '../db/client';
import { seedDemo } from '../db/seed';
import { createDatabase, dropDatabase } from '../dev/postgres';
import { startFakeSmtp } from '../mail/fake-smtp';
import { DEMO_PASSWORD } from '../db/seed-data';

export interface Harness extends CreatedApp { database: Db; smtpUrl: string; close: () => Promise<void> }

/**
 * The real app on the test database that `npm test` prepared (DATABASE_URL), with its own local
 * mail store. Options override the environment, e.g. a short idle time-out.
 */
export async function startHarness(env: Record<string, string> = {}, options: { jobs?: boolean | 'send-only'; databaseUrl?: string } = {}): Promise<Harness> {
  const url = options.databaseUrl ?? process.env.DATABASE_URL;
  if (!url) throw new Error('API tests need DATABASE_URL (run them through npm test)');
  const database = openDatabase(url, 5);
  const smtp = await startFakeSmtp(database.db);
  const config = loadConfig({ ...process.env, DATABASE_URL: url, SMTP_URL: smtp.url, SIGN_IN_RATE_LIMIT: '1000', PUBLIC_URL: 'http://parallax.test', ...env });
  const created = createApp(config, database);
  if (options.jobs) await created.ctx.jobs.start({ work: options.jobs === true });
  return {
    ...created,
    database,
    smtpUrl: smtp.url,
    close: async () => {
      await created.ctx.mail.stop();
      await created.ctx.jobs.stop();
      await smtp.close();
      await database.close();
    },
  };
}

/** An agent with the XSRF cookie in hand; `xsrf` is the header value to send on mutations. */
export async function anonymous(h: CreatedApp): Promise<{ agent: TestAgent; xsrf: string }> {
  const agent = request.agent(h.app);
  const res = await agent.get('/api/v1/session');
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='));
  if (!cookie) throw new Error('no XSRF-TOKEN cookie on GET');
  return { agent, xsrf: decodeURIComponent(cookie.split(';')[0].slice('XSRF-TOKEN='.length)) };
}

export async function signedIn(h: CreatedApp, email: string, password = DEMO_PASSWORD) {
  const session = await anonymous(h);
  const res = await session.agent.post('/api/v1/session').set('X-XSRF-TOKEN', session.xsrf).send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
  return session;
}

export type Session = Awaited<ReturnType<typeof signedIn>>;

/** A signed-in session's writes under /api/v1, with the XSRF header Angular sends. */
export const apiPost = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
export const apiPut = (s: Session, path: string, body: object) => s.agent.put(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
export const apiPatch = (s: Session, path: string, body: object) => s.agent.patch(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
export const apiDelete = (s: Session, path: string) => s.agent.delete(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send({});

let counter = 0;
/** A unique e-mail per call, so tests never trip over each other's users. */
export const uniqueEmail = (prefix: string) => `${prefix}.${Date.now().toString(36)}.${++counter}@valeharbor.example`;

/** supertest parser that keeps a binary body (PDF, xlsx) as a Buffer. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const binary = (res: any, done: (err: Error | null, body: Buffer) => void): void => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

/**
 * A database of its own beside the test database (same server), migrated and seeded with the demo:
 * for suites that break what they test (a history chain) and must not break it for the others.
 */
export async function freshDatabase(tag: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const base = process.env.DATABASE_URL;
  if (!base) throw new Error('API tests need DATABASE_URL (run them through npm test)');
  const name = `parallax_${tag}_${process.pid}_${++counter}`;
  const server = (db: string) => Object.assign(new URL(base), { pathname: `/${db}` }).toString();
  await createDatabase(server('postgres'), name);
  await migrateDatabase(server(name));
  const seed = openDatabase(server(name), 2);
  await seedDemo(seed.db);
  await seed.close();
  return { url: server(name), drop: () => dropDatabase(server('postgres'), name) };
}

/** The SQL the app sends while `run` runs (the app and the test share one pool). */
export async function queriesDuring(h: Harness, run: () => Promise<unknown>): Promise<string[]> {
  const pool = h.database.pool as unknown as { query: (...args: unknown[]) => unknown };
  const original = pool.query;
  const seen: string[] = [];
  pool.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text: string };
    seen.push(typeof q === 'string' ? q : q.text);
    return original.apply(this, args);
  };
  try {
    await run();
  } finally {
    pool.query = original;
  }
  return seen;
}

/** A demo comparison entered and analysed by the technologist, submitted, and signed by the director; its id. */
export async function signedStudy(h: Harness, title: string): Promise<number> {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const director = await signedIn(h, 'director@valeharbor.example');
  const study = await analysedComparison(h, tech, title);
  await tech.agent.post(`/api/v1/studies/${study.id}/submit`).set('X-XSRF-TOKEN', tech.xsrf).send({}).expect(200);
  await director.agent.post(`/api/v1/studies/${study.id}/sign`).set('X-XSRF-TOKEN', director.xsrf).send({ meaning: 'accepted', password: 'parallax-demo' }).expect(200);
  return study.id;
}
