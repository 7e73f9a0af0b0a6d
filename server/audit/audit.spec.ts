import { desc, eq, sql } from 'drizzle-orm';
import { auditEvents } from '../db/schema';
import { Harness, startHarness } from '../test/harness';
import { auditKey } from './audit-key';
import { eventHash, recordAudit } from './audit';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

it('chains each event to the one before and the database refuses to change or delete them', async () => {
  const actor = { id: null, name: 'test', laboratoryId: null };
  await h.database.db.transaction((tx) => recordAudit(tx, actor, { action: 'test.one', entity: 'test', after: { n: 1 } }));
  await h.database.db.transaction((tx) => recordAudit(tx, actor, { action: 'test.two', entity: 'test', after: { n: 2.5 } }));
  const [second, first] = await h.database.db.select().from(auditEvents).where(sql`${auditEvents.laboratoryId} IS NULL`).orderBy(desc(auditEvents.id)).limit(2);
  expect(second.previousHash).toBe(first.hash);
  expect(first.previousHash).toMatch(/^[0-9a-f]{64}$/);
  const { id: _id, hash, ...content } = second;
  expect(second.keyId).toBe(auditKey().id);
  expect(eventHash(content)).toBe(hash);
  // Keyed: the plain SHA-256 of the same content, which anyone with the code could compute, is not the hash.
  expect(eventHash({ ...content, keyId: null })).not.toBe(hash);
  await expect(h.database.db.update(auditEvents).set({ reason: 'edited' }).where(eq(auditEvents.id, second.id))).rejects.toThrow();
  await expect(h.database.db.delete(auditEvents).where(eq(auditEvents.id, second.id))).rejects.toThrow();
  await expect(h.database.db.execute(sql`TRUNCATE audit_events`)).rejects.toThrow();
});
