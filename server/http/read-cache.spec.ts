import { eq, sql } from 'drizzle-orm';
import type { PoolClient } from 'pg';
import { recordAudit } from '../audit/audit';
import { hashPassword } from '../auth/passwords';
import { analytes, instruments, laboratories, laboratoryVersions, users } from '../db/schema';
import { catalogIds, createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { Harness, queriesDuring, signedIn, startHarness, uniqueEmail } from '../test/harness';
import { CACHED_READS } from './read-cache';

/**
 * The read cache (server/http/read-cache.ts) answers a repeated read from memory, keyed by the laboratory's
 * change counter, which triggers move at every committed change (migration 0012). These tests read, read
 * again (a hit), change something, and read once more: the answer must be a fresh one showing the change.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const PASSWORD = 'read-cache-password-1';
const VALE = 'Vale Harbor Regional Laboratory';

const labId = async (name = VALE) => (await h.database.db.select().from(laboratories).where(eq(laboratories.name, name)))[0].id;
const versionOf = async (lab: number) => (await h.database.db.select().from(laboratoryVersions).where(eq(laboratoryVersions.laboratoryId, lab)))[0].version;

/** A person of this test's own (so renaming them or changing their roles touches no demo user), signed in. */
async function person(name: string, roles: string[], lab = VALE): Promise<Session & { id: number }> {
  const email = uniqueEmail('cache');
  const [row] = await h.database.db.insert(users).values({ laboratoryId: await labId(lab), name, email, roles, passwordHash: await hashPassword(PASSWORD) }).returning({ id: users.id });
  return { ...(await signedIn(h, email, PASSWORD)), id: row.id };
}

/** A draft comparison of Cedar Point, the other demo laboratory. */
async function cedarStudy(s: Session, title: string): Promise<number> {
  const lab = await labId('Cedar Point Clinical Laboratory');
  const [analyte] = await h.database.db.select().from(analytes).where(eq(analytes.laboratoryId, lab));
  const [one, two] = (await h.database.db.select().from(instruments).where(eq(instruments.laboratoryId, lab))).sort((p, q) => p.id - q.id);
  const res = await send(s, 'post', '/studies', { kind: 'method-comparison', title, analyteId: analyte.id, comparativeInstrumentId: one.id, candidateInstrumentId: two.id });
  expect(res.status).toBe(201);
  return res.body.id;
}

/** One GET, and whether the cache answered it. */
async function read(s: Session, url: string) {
  const before = h.readCache!.stats.hits;
  const res = await s.agent.get(`/api/v1${url}`);
  return { res, hit: h.readCache!.stats.hits === before + 1, body: res.body };
}

/** Reads twice: the second must come from the cache, with the same bytes. */
async function kept(s: Session, url: string) {
  const first = await read(s, url);
  expect(first.res.status).toBe(200);
  const again = await read(s, url);
  expect(again.hit).toBe(true);
  expect(again.res.text).toBe(first.res.text);
  return again.body;
}

/** After a change: the read is not a hit, and the answer is the fresh one. */
async function fresh(s: Session, url: string) {
  const r = await read(s, url);
  expect(r.res.status).toBe(200);
  expect(r.hit).toBe(false);
  return r.body;
}

const send = (s: Session, method: 'post' | 'put' | 'patch', url: string, body: object = {}) => s.agent[method](`/api/v1${url}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

it('answers a repeated read from memory with the same bytes and headers, and asks the database only for the session', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech, 'Kept answer');
  for (const url of ['/worklist', '/studies?page=1&pageSize=5&sort=title&order=asc', `/studies/${study.id}`, `/studies/${study.id}/history`]) {
    const first = await read(tech, url);
    const again = await read(tech, url);
    expect(first.res.status).toBe(200);
    expect(again.hit).toBe(true);
    expect(Buffer.from(again.res.text)).toEqual(Buffer.from(first.res.text));
    for (const header of ['content-type', 'cache-control', 'etag', 'content-length', 'x-content-type-options']) expect([url, again.res.headers[header]]).toEqual([url, first.res.headers[header]]);
  }
  const url = `/studies/${study.id}`;
  const queries = await queriesDuring(h, async () => expect((await read(tech, url)).hit).toBe(true));
  expect(queries).toHaveLength(1);
  expect(queries[0]).toMatch(/FROM session s .*laboratory_versions/s);
  // A conditional request is answered from memory as a fresh answer would be: 304.
  const etag = (await read(tech, url)).res.headers.etag;
  const conditional = await tech.agent.get(`/api/v1${url}`).set('If-None-Match', etag);
  expect(conditional.status).toBe(304);
});

it('answers afresh after every change made through the app: rows, settings, an analysis, a submission, a name, roles and a signature', async () => {
  const author = await person('Ines Varga', ['technologist']);
  const director = await person('Dr. Osei Mensah', ['director']);
  const admin = await signedIn(h, 'admin@valeharbor.example');
  const study = await createComparison(h, author, `Every change ${Date.now()}`);
  const url = `/studies/${study.id}`;

  expect((await kept(director, url)).n).toBe(0);
  const put = await send(author, 'put', `${url}/specimens`, { version: study.version, rows: inventedPairs(40) }).expect(200);
  expect((await fresh(director, url)).n).toBe(40);

  await kept(director, url);
  await send(author, 'patch', url, { version: put.body.version, settings: { resamples: 2000 } }).expect(200);
  expect((await fresh(director, url)).settings.resamples).toBe(2000);

  expect((await kept(director, url)).findings).toBe('none');
  const queued = await send(author, 'post', `${url}/analyses`).expect(202);
  expect((await waitForAnalysis(author, queued.body.id)).state).toBe('done');
  expect((await fresh(director, url)).findings).toBe('current');

  expect((await kept(director, '/worklist')).awaitingSignature.map((s: { id: number }) => s.id)).not.toContain(study.id);
  await send(author, 'post', `${url}/submit`).expect(200);
  await h.ctx.mail.flush();
  expect((await fresh(director, '/worklist')).awaitingSignature.map((s: { id: number }) => s.id)).toContain(study.id);
  expect((await fresh(director, url)).mayISign).toMatchObject({ allowed: true, why: expect.stringContaining('Ines Varga') });

  await kept(director, url);
  await send(admin, 'patch', `/users/${author.id}`, { name: 'Ines Varga-Holm' }).expect(200);
  await h.ctx.mail.flush();
  expect((await fresh(director, url)).mayISign.why).toContain('Ines Varga-Holm');

  await send(admin, 'patch', `/users/${director.id}`, { roles: ['quality'] }).expect(200);
  await h.ctx.mail.flush();
  expect((await fresh(director, url)).mayISign.allowed).toBe(false);
  await kept(director, url);
  await send(admin, 'patch', `/users/${director.id}`, { roles: ['director'] }).expect(200);
  await h.ctx.mail.flush();
  expect((await fresh(director, url)).mayISign.allowed).toBe(true);

  expect((await kept(author, url)).state).toBe('awaiting-signoff');
  expect((await kept(author, `${url}/history`)).map((e: { action: string }) => e.action)).not.toContain('study.signed');
  await send(director, 'post', `${url}/sign`, { meaning: 'accepted', password: PASSWORD }).expect(200);
  await h.ctx.mail.flush();
  expect((await fresh(author, url)).state).toBe('signed');
  expect((await fresh(author, `${url}/history`)).map((e: { action: string }) => e.action)).toContain('study.signed');
});

it('answers afresh after a change made behind the app, in plain SQL, to any table a read shows', async () => {
  const lab = await labId();
  const tag = Date.now().toString(36);
  const [analyte] = await h.database.db.insert(analytes).values({ laboratoryId: lab, name: `Lactate ${tag}`, unit: 'mmol/L', decisionLevels: [2, 4], allowableBiasAbsolute: 0.2, allowableBiasSource: 'invented for this test' }).returning();
  const [line1, line2] = await h.database.db.insert(instruments).values([{ laboratoryId: lab, name: `Gas line A ${tag}` }, { laboratoryId: lab, name: `Gas line B ${tag}` }]).returning();
  const author = await person('Rafael Quint', ['technologist']);
  const reader = await person('Mara Quint', ['quality']);
  const created = await send(author, 'post', '/studies', { kind: 'method-comparison', title: `Behind ${tag}`, analyteId: analyte.id, comparativeInstrumentId: line1.id, candidateInstrumentId: line2.id, settings: { resamples: 1000, regressionResamples: 1000 } }).expect(201);
  const id = created.body.id as number;
  await send(author, 'put', `/studies/${id}/specimens`, { version: created.body.version, rows: inventedPairs(30) }).expect(200);
  const queued = await send(author, 'post', `/studies/${id}/analyses`).expect(202);
  await waitForAnalysis(author, queued.body.id);
  const url = `/studies/${id}`;
  const run = (q: ReturnType<typeof sql>) => h.database.db.execute(q);

  const cases: [string, ReturnType<typeof sql>, (study: Record<string, unknown>) => void, ReturnType<typeof sql>?][] = [
    ['a study', sql`UPDATE studies SET title = title || ' (renamed)' WHERE id = ${id}`, (s) => expect(s.title).toBe(`Behind ${tag} (renamed)`)],
    ['a row changed', sql`UPDATE specimens SET excluded = true, exclusion_reason = 'clotted' WHERE study_id = ${id} AND position = 1`, (s) => expect(s).toMatchObject({ n: 29, findings: 'out-of-date' })],
    ['a row added', sql`INSERT INTO specimens (study_id, position, label, comparative, candidate, entered_by) VALUES (${id}, 31, 'X31', 5, 5.1, ${author.id})`, (s) => expect(s.n).toBe(30)],
    ['a row removed', sql`DELETE FROM specimens WHERE study_id = ${id} AND position IN (30, 31)`, (s) => expect(s.n).toBe(28)],
    ['an analysis', sql`UPDATE analyses SET state = 'queued' WHERE id = ${queued.body.id}`, (s) => expect(s.findings).toBe('queued'), sql`UPDATE analyses SET state = 'done' WHERE id = ${queued.body.id}`],
    ['an analyte', sql`UPDATE analytes SET name = name || ' (venous)' WHERE id = ${analyte.id}`, (s) => expect(s.analyte).toMatchObject({ name: `Lactate ${tag} (venous)` })],
    ['an instrument', sql`UPDATE instruments SET name = name || ' (ICU)' WHERE id = ${line2.id}`, (s) => expect(s.instruments).toBe(`Gas line A ${tag} → Gas line B ${tag} (ICU)`)],
    ['a person', sql`UPDATE users SET name = 'Rafael Quint-Lowe' WHERE id = ${author.id}`, (s) => expect(s.createdBy).toMatchObject({ name: 'Rafael Quint-Lowe' })],
  ];
  for (const [what, change, check, undo] of cases) {
    await kept(reader, url);
    await run(change);
    const after = await fresh(reader, url);
    if (undo) await run(undo);
    try { check(after); } catch (err) { throw new Error(`after ${what}: ${(err as Error).message}`); }
  }

  // The laboratory's setting shows in who may sign; an event recorded by code other than a route shows in the history.
  await send(author, 'post', `/studies/${id}/analyses`).expect(202).then((r) => waitForAnalysis(author, r.body.id));
  const submitted = await send(author, 'post', `${url}/submit`);
  if (submitted.status !== 200) throw new Error(JSON.stringify(submitted.body));
  await h.ctx.mail.flush();
  const before = (await kept(reader, url)).mayISign.why as string;
  const [{ allowSelfSign }] = await h.database.db.select().from(laboratories).where(eq(laboratories.id, lab));
  try {
    await run(sql`UPDATE laboratories SET allow_self_sign = ${!allowSelfSign} WHERE id = ${lab}`);
    expect((await fresh(reader, url)).mayISign.why).not.toBe(before);
  } finally {
    await run(sql`UPDATE laboratories SET allow_self_sign = ${allowSelfSign} WHERE id = ${lab}`);
  }
  await kept(reader, `${url}/history`);
  await h.database.db.transaction((tx) => recordAudit(tx, { id: null, name: 'a script', laboratoryId: lab }, { action: 'study.updated', entity: 'study', entityId: id, studyId: id, reason: 'checked by hand' }));
  expect((await fresh(reader, `${url}/history`)).at(-1)).toMatchObject({ userName: 'a script', action: 'study.updated' });
});

it('keeps a laboratory\'s answers when another laboratory changes', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const other = await signedIn(h, 'tech@cedarpoint.example');
  const vale = await labId();
  const cedar = await labId('Cedar Point Clinical Laboratory');
  const study = await createComparison(h, tech, 'Unmoved by others');
  await kept(tech, `/studies/${study.id}`);
  await kept(tech, '/worklist');
  const valeVersion = await versionOf(vale);
  const cedarVersion = await versionOf(cedar);
  const theirs = await cedarStudy(other, 'Elsewhere');
  await h.database.db.execute(sql`UPDATE studies SET title = 'Elsewhere, renamed' WHERE id = ${theirs}`);
  await h.database.db.execute(sql`UPDATE analytes SET decimals = decimals WHERE laboratory_id = ${cedar}`);
  expect(await versionOf(cedar)).toBeGreaterThan(cedarVersion);
  expect(await versionOf(vale)).toBe(valeVersion);
  expect((await read(tech, `/studies/${study.id}`)).hit).toBe(true);
  expect((await read(tech, '/worklist')).hit).toBe(true);
});

it('never gives one person\'s answer to another, whatever their roles', async () => {
  const enterer = await person('Lena Brandt', ['technologist', 'director']);
  const colleague = await person('Jonas Brandt', ['technologist', 'director']);
  const technologist = await person('Kai Brandt', ['technologist']);
  const study = await createComparison(h, enterer, `Whose answer ${Date.now()}`);
  await send(enterer, 'put', `/studies/${study.id}/specimens`, { version: study.version, rows: inventedPairs(40) }).expect(200);
  const queued = await send(enterer, 'post', `/studies/${study.id}/analyses`).expect(202);
  await waitForAnalysis(enterer, queued.body.id);
  await send(enterer, 'post', `/studies/${study.id}/submit`).expect(200);
  await h.ctx.mail.flush();
  const url = `/studies/${study.id}`;
  const answers = new Map<string, string>();
  for (const [who, s] of [['enterer', enterer], ['colleague', colleague], ['technologist', technologist]] as const) {
    const first = await read(s, url);
    expect([who, first.hit]).toEqual([who, false]);
    answers.set(who, first.res.text);
  }
  expect(JSON.parse(answers.get('enterer')!).mayISign.allowed).toBe(false);
  expect(JSON.parse(answers.get('colleague')!).mayISign.allowed).toBe(true);
  expect(JSON.parse(answers.get('technologist')!).mayISign.why).not.toBe(JSON.parse(answers.get('colleague')!).mayISign.why);
  for (const [who, s] of [['enterer', enterer], ['colleague', colleague], ['technologist', technologist]] as const) {
    const again = await read(s, url);
    expect([who, again.hit, again.res.text]).toEqual([who, true, answers.get(who)]);
  }
  // The worklist of each is their own too.
  expect((await read(colleague, '/worklist')).body.awaitingSignature.map((s: { id: number }) => s.id)).toContain(study.id);
  expect((await read(enterer, '/worklist')).body.awaitingSignature.map((s: { id: number }) => s.id)).not.toContain(study.id);
});

it('keeps no error answer: a 404, a 400, a 503 while the database is away', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const cedarTech = await signedIn(h, 'tech@cedarpoint.example');
  const theirs = await cedarStudy(cedarTech, 'Not yours');
  const stored = h.readCache!.stats.stored;
  for (const [url, status] of [['/studies/99999999', 404], [`/studies/${theirs}`, 404], ['/studies?pageSize=many', 400]] as const) {
    for (let i = 0; i < 2; i++) {
      const r = await read(tech, url);
      expect([url, r.res.status, r.hit]).toEqual([url, status, false]);
    }
  }
  expect(h.readCache!.stats.stored).toBe(stored);

  const study = await createComparison(h, tech, 'Database away once');
  const url = `/studies/${study.id}`;
  const pool = h.database.pool as unknown as { query: (...args: unknown[]) => Promise<unknown> };
  const original = pool.query;
  let failed = false;
  pool.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text: string };
    if (!failed && /from "studies"/i.test(typeof q === 'string' ? q : q.text)) {
      failed = true;
      return Promise.reject(Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' }));
    }
    return original.apply(this, args);
  };
  try {
    const away = await read(tech, url);
    expect([away.res.status, away.hit]).toEqual([503, false]);
  } finally {
    pool.query = original;
  }
  expect(failed).toBe(true);
  const back = await read(tech, url);
  expect([back.res.status, back.hit, back.body.id]).toEqual([200, false, study.id]);
  expect((await read(tech, url)).hit).toBe(true);
});

it('keeps no more than its bound, forgetting the least recently used', async () => {
  const small = await startHarness({ READ_CACHE_MB: '0.02' });
  try {
    const cache = small.readCache!;
    expect(cache.maxBytes).toBe(Math.floor(0.02 * 1024 * 1024));
    const tech = await signedIn(small, 'tech@valeharbor.example');
    const page = (k: number) => `/api/v1/studies?page=${k}&pageSize=1`;
    await tech.agent.get(page(1)).expect(200);
    const hits = cache.stats.hits;
    await tech.agent.get(page(1)).expect(200);
    expect(cache.stats.hits).toBe(hits + 1);
    for (let k = 2; k <= 150; k++) {
      await tech.agent.get(page(k)).expect(200);
      expect(cache.size).toBeLessThanOrEqual(cache.maxBytes);
    }
    expect(cache.stats.stored).toBeGreaterThanOrEqual(150);
    expect(cache.entries).toBeLessThan(150);
    const misses = cache.stats.misses;
    await tech.agent.get(page(1)).expect(200);
    expect(cache.stats.misses).toBe(misses + 1);
    // One answer may take an eighth of the bound at most: a larger one is answered and not kept.
    const notStored = cache.stats.notStored;
    const big = await tech.agent.get('/api/v1/studies?page=1&pageSize=25').expect(200);
    expect(big.text.length).toBeGreaterThan(cache.maxBytes / 8);
    expect(cache.stats.notStored).toBe(notStored + 1);
  } finally {
    await small.close();
  }
});

it('moves the counter at commit, so a change and the history chain\'s lock taken in either order never deadlock', async () => {
  const lab = await labId();
  const { analyteId, comparativeInstrumentId } = await catalogIds(h);
  const version = await versionOf(lab);
  const a: PoolClient = await h.database.pool.connect();
  const b: PoolClient = await h.database.pool.connect();
  try {
    await a.query('SET lock_timeout = 10000');
    await b.query('SET lock_timeout = 10000');
    // A: a change, then the chain lock (as a service that writes and then calls recordAudit).
    await a.query('BEGIN');
    await a.query('UPDATE analytes SET decimals = decimals WHERE id = $1', [analyteId]);
    // B: the chain lock, then a change (as recordAudit's own insert of the event, or a change after it).
    await b.query('BEGIN');
    await b.query('SELECT pg_advisory_xact_lock(7001, $1)', [lab]);
    const bChanges = b.query('UPDATE instruments SET serial = serial WHERE id = $1', [comparativeInstrumentId]);
    const aLocks = a.query('SELECT pg_advisory_xact_lock(7001, $1)', [lab]);
    await bChanges;
    // Nothing is moved before commit: another connection reads the counter as it was.
    expect(await versionOf(lab)).toBe(version);
    await b.query('COMMIT');
    await aLocks;
    await a.query('COMMIT');
  } catch (err) {
    await a.query('ROLLBACK').catch(() => undefined);
    await b.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    a.release();
    b.release();
  }
  expect(await versionOf(lab)).toBe(version + 2);
});

it('has every table\'s rows move the counter, but for a few named with their reason', async () => {
  const EXEMPT: Record<string, string> = {
    session: 'read afresh by every request before the cache is asked; no answer shows it',
    sign_in_limits: 'failed sign-ins counted by address text; no answer shows it',
    laboratory_versions: 'the counter itself',
  };
  const { rows: found } = await h.database.db.execute<{ table: string; trigger: string | null; deferred: boolean; enabled: string }>(sql`
    SELECT c.relname AS "table", t.tgname AS "trigger", (t.tgdeferrable AND t.tginitdeferred) AS "deferred", t.tgenabled AS "enabled"
      FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
      LEFT JOIN pg_trigger t ON t.tgrelid = c.oid AND NOT t.tgisinternal
     WHERE n.nspname = 'public' AND c.relkind = 'r'`);
  const tables = [...new Set(found.map((r) => r.table))].sort();
  // A trigger counts when it is enabled, and the one that moves the counter only when it waits for the commit.
  const rows = tables.map((table) => ({
    table,
    triggers: found.filter((r) => r.table === table && r.trigger?.includes('version') && r.enabled === 'O' && (!r.trigger.endsWith('_bump_version') || r.deferred))
      .map((r) => r.trigger!).sort(),
  }));
  expect(rows.length).toBeGreaterThan(15);
  const wanted = (t: string) => [`${t}_bump_version`, `${t}_bump_version_truncate`, `${t}_note_version_delete`, `${t}_note_version_insert`, `${t}_note_version_update`];
  const lacking = rows.filter((r) => !(r.table in EXEMPT) && JSON.stringify(r.triggers) !== JSON.stringify(wanted(r.table))).map((r) => `${r.table}: ${r.triggers.join(', ') || 'none'}`);
  expect(lacking).toEqual([]);
  expect(Object.keys(EXEMPT).filter((t) => !rows.some((r) => r.table === t))).toEqual([]);
  // Only routes that read are kept.
  expect(CACHED_READS.every((r) => r.method === 'get')).toBe(true);
  expect(h.routes.filter((r) => (r.before ?? []).includes(h.readCache!.middleware)).map((r) => r.path).sort()).toEqual(CACHED_READS.map((r) => r.path).sort());
});
