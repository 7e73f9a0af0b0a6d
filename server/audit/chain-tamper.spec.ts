import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { auditEvents, laboratories, studies } from '../db/schema';
import { canonicalJson, sha256Hex } from './canonical-json';
import { anonymous, freshDatabase, Harness, signedIn, startHarness } from '../test/harness';

/**
 * What someone who owns the database but not the server's key can do to the history, and what the
 * re-checks say about it. Each test breaks a database of its own.
 */
const opened: { h: Harness; drop: () => Promise<void> }[] = [];
afterAll(async () => {
  for (const o of opened) { await o.h.close(); await o.drop(); }
});

async function freshApp(tag: string): Promise<Harness> {
  const db = await freshDatabase(tag);
  const h = await startHarness({}, { databaseUrl: db.url });
  opened.push({ h, drop: db.drop });
  return h;
}

/** As the database owner, with triggers off. */
const asOwner = (h: Harness, statement: ReturnType<typeof sql>) =>
  h.database.db.transaction(async (tx) => {
    await tx.execute(sql`SET LOCAL session_replication_role = replica`);
    await tx.execute(statement);
  });

async function chainCheck(h: Harness, signedInAlready?: Awaited<ReturnType<typeof signedIn>>) {
  const quality = signedInAlready ?? await signedIn(h, 'quality@valeharbor.example');
  return (await quality.agent.post('/api/v1/audit/chain-check').set('X-XSRF-TOKEN', quality.xsrf).expect(200)).body as {
    passed: boolean; checks: { name: string; passed: boolean; detail: string }[];
  };
}
const check = (report: Awaited<ReturnType<typeof chainCheck>>, name: string) => report.checks.find((c) => c.name === name)!;

async function valeHarbor(h: Harness) {
  return (await h.database.db.select().from(laboratories)).find((l) => l.name.startsWith('Vale Harbor'))!.id;
}

it('finds both chains intact on a fresh installation', async () => {
  const h = await freshApp('chain_ok');
  const report = await chainCheck(h);
  expect(report.passed).toBe(true);
  expect(check(report, 'Laboratory history').detail).toMatch(/^All [\d,]+ events of the laboratory's history are intact/);
  expect(check(report, 'History without a laboratory').passed).toBe(true);
});

it('names an event that was changed and the rest of the chain re-hashed with the code but without the key', async () => {
  const h = await freshApp('chain_rewritten');
  const lab = await valeHarbor(h);
  const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.laboratoryId, lab)).orderBy(auditEvents.id);
  const target = events[Math.floor(events.length / 2)];
  // The owner edits one event, then re-makes every hash from there on with the plain SHA-256 the code would give.
  let previous = events[events.indexOf(target) - 1].hash;
  for (const e of events.slice(events.indexOf(target))) {
    const { id, hash: _old, keyId: _k, ...content } = e;
    const changed = { ...content, reason: id === target.id ? 'nothing happened here' : content.reason, previousHash: previous };
    const hash = sha256Hex(canonicalJson({ ...changed, at: changed.at.toISOString() }));
    await asOwner(h, sql`UPDATE audit_events SET reason = ${changed.reason}, previous_hash = ${previous}, hash = ${hash}, key_id = NULL WHERE id = ${id}`);
    previous = hash;
  }
  const report = await chainCheck(h);
  expect(report.passed).toBe(false);
  const lines = check(report, 'Laboratory history');
  expect(lines.passed).toBe(false);
  expect(lines.detail).toContain(`event ${target.id} (${target.action}`);
  expect(lines.detail).toMatch(/carries a hash made without the server key, although the events before it are keyed: it was rewritten outside Parallax/);
  expect(check(report, 'History without a laboratory').passed).toBe(true);
  // A signed study of that laboratory now fails its re-check too.
  const [signed] = await h.database.db.select().from(studies).where(and(eq(studies.laboratoryId, lab), eq(studies.state, 'signed'))).limit(1);
  const quality = await signedIn(h, 'quality@valeharbor.example');
  const integrity = (await quality.agent.post(`/api/v1/studies/${signed.id}/integrity-check`).set('X-XSRF-TOKEN', quality.xsrf).expect(200)).body;
  expect(integrity.checks.find((c: { name: string }) => c.name === 'History chain')).toMatchObject({ passed: false, detail: expect.stringMatching(/^The laboratory's history chain is broken: /) });
});

it('says the newest event was removed, though the rest of the chain is intact', async () => {
  const h = await freshApp('chain_truncated');
  const lab = await valeHarbor(h);
  const quality = await signedIn(h, 'quality@valeharbor.example');
  const [newest] = await h.database.db.select().from(auditEvents).where(eq(auditEvents.laboratoryId, lab)).orderBy(desc(auditEvents.id)).limit(1);
  await asOwner(h, sql`DELETE FROM audit_events WHERE id = ${newest.id}`);
  const lines = check(await chainCheck(h, quality), 'Laboratory history');
  expect(lines.passed).toBe(false);
  expect(lines.detail).toMatch(new RegExp(`the newest 1 event was removed: the chain ends at event [\\d,]+, but its signed record says [\\d,]+ events ending at event ${newest.id}`));
  // Events written afterwards do not hide it.
  expect(check(await chainCheck(h), 'Laboratory history').detail).toMatch(/1 event was removed from the chain: it holds \d+, its signed record counts \d+/);
});

it('checks the chain of events with no laboratory, and names a broken one', async () => {
  const h = await freshApp('chain_system');
  const stranger = await anonymous(h);
  await stranger.agent.post('/api/v1/session').set('X-XSRF-TOKEN', stranger.xsrf).send({ email: 'nobody@nowhere.example', password: 'wrong-password-x' }).expect(401);
  const [failed] = await h.database.db.select().from(auditEvents).where(and(isNull(auditEvents.laboratoryId), eq(auditEvents.action, 'sign-in.failed'))).orderBy(desc(auditEvents.id)).limit(1);
  expect(check(await chainCheck(h), 'History without a laboratory').passed).toBe(true);
  await asOwner(h, sql`UPDATE audit_events SET after = jsonb_set(after, '{email}', '"someone.else@nowhere.example"') WHERE id = ${failed.id}`);
  const lines = check(await chainCheck(h), 'History without a laboratory');
  expect(lines.passed).toBe(false);
  expect(lines.detail).toMatch(new RegExp(`^One problem in the history of events that belong to no laboratory .*: event ${failed.id} \\(sign-in.failed, .*\\) no longer matches its hash: it was changed after it was written\\.$`));
});
