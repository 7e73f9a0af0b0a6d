import { eq } from 'drizzle-orm';
import { mailMessages, mailOutbox } from '../db/schema';
import { Harness, startHarness } from '../test/harness';
import { deliverOutbox, queueMail, smtpTransport } from './outbox';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

it('keeps a message when SMTP is down and delivers it on a later attempt', async () => {
  const subject = `Outbox test ${Date.now()}`;
  await h.database.db.transaction((tx) => queueMail(tx, { laboratoryId: null, to: ['someone@valeharbor.example'], subject, text: 'hello' }));
  const down = smtpTransport('smtp://127.0.0.1:9'); // nothing listens on the discard port
  expect(await deliverOutbox(h.database.db, down, 'test@parallax')).toBe(0);
  const [waiting] = await h.database.db.select().from(mailOutbox).where(eq(mailOutbox.subject, subject));
  expect(waiting).toMatchObject({ sentAt: null, attempts: 1 });
  expect(waiting.lastError).toMatch(/ECONNREFUSED|connect/i);
  await h.database.db.update(mailOutbox).set({ nextAttemptAt: new Date(0) }).where(eq(mailOutbox.id, waiting.id));
  expect(await deliverOutbox(h.database.db, smtpTransport(h.smtpUrl), 'test@parallax')).toBeGreaterThanOrEqual(1);
  for (let i = 0; i < 50 && !(await h.database.db.select().from(mailMessages).where(eq(mailMessages.subject, subject))).length; i++) {
    await new Promise((r) => setTimeout(r, 100));
  }
  const [received] = await h.database.db.select().from(mailMessages).where(eq(mailMessages.subject, subject));
  expect(received.to).toEqual(['someone@valeharbor.example']);
});
