import { and, asc, eq, isNull, lte, sql } from 'drizzle-orm';
import nodemailer, { Transporter } from 'nodemailer';
import type { Database, Executor } from '../db/client';
import { mailOutbox } from '../db/schema';

export interface OutgoingMail { laboratoryId: number | null; to: string[]; subject: string; text: string }

/** Queues a message in the caller's transaction; it is sent after commit and retried until SMTP takes it. */
export async function queueMail(tx: Executor, mail: OutgoingMail): Promise<void> {
  await tx.insert(mailOutbox).values(mail);
}

export function smtpTransport(url: string): Transporter {
  const u = new URL(url);
  return nodemailer.createTransport({
    host: u.hostname,
    port: Number(u.port || 25),
    secure: u.protocol === 'smtps:',
    ignoreTLS: u.protocol === 'smtp:' && (u.hostname === '127.0.0.1' || u.hostname === 'localhost'),
    auth: u.username ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } : undefined,
  });
}

const BACKOFF_SECONDS = [5, 30, 120, 600, 1800];

/**
 * Sends every due message. Rows are claimed with FOR UPDATE SKIP LOCKED, so several processes can
 * deliver from one outbox without sending a message twice; a failure is recorded and retried later.
 */
export async function deliverOutbox(db: Database, transport: Transporter, from: string): Promise<number> {
  let sent = 0;
  for (;;) {
    const done = await db.transaction(async (tx) => {
      const [row] = await tx
        .select()
        .from(mailOutbox)
        .where(and(isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, new Date())))
        .orderBy(asc(mailOutbox.id))
        .limit(1)
        .for('update', { skipLocked: true });
      if (!row) return false;
      try {
        await transport.sendMail({ from, to: row.to.join(', '), subject: row.subject, text: row.text });
        await tx.update(mailOutbox).set({ sentAt: new Date(), attempts: row.attempts + 1, lastError: null }).where(eq(mailOutbox.id, row.id));
        sent++;
      } catch (err) {
        const wait = BACKOFF_SECONDS[Math.min(row.attempts, BACKOFF_SECONDS.length - 1)];
        await tx.update(mailOutbox).set({
          attempts: row.attempts + 1,
          lastError: (err as Error).message.slice(0, 500),
          nextAttemptAt: sql`now() + make_interval(secs => ${wait})`,
        }).where(eq(mailOutbox.id, row.id));
      }
      return true;
    });
    if (!done) return sent;
  }
}
