import { randomBytes } from 'node:crypto';
import { and, eq, gt, isNotNull, isNull, ne } from 'drizzle-orm';
import type { PasswordLinkInfo } from '../../shared/schemas';
import { recordAudit } from '../audit/audit';
import { sha256Hex } from '../audit/canonical-json';
import type { Database, Executor } from '../db/client';
import { passwordLinks, users } from '../db/schema';
import { AppError } from '../http/app-error';
import { queueMail } from '../mail/outbox';
import { endSessions, updateUser } from './auth.repository';
import { hashPassword } from './passwords';

export const LINK_HOURS = 72;
const INVALID = 'This link is not valid or has expired; ask your administrator for a new invitation';

/** Makes a one-time set-password link (only its hash is stored) and queues the invitation e-mail. */
export async function sendPasswordLink(
  tx: Executor, user: { id: number; name: string; email: string; laboratoryId: number }, labName: string, publicUrl: string,
): Promise<void> {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + LINK_HOURS * 3600_000);
  await tx.update(passwordLinks).set({ usedAt: new Date() }).where(and(eq(passwordLinks.userId, user.id), isNull(passwordLinks.usedAt)));
  await tx.insert(passwordLinks).values({ userId: user.id, tokenHash: sha256Hex(token), expiresAt });
  await queueMail(tx, {
    laboratoryId: user.laboratoryId,
    to: [user.email],
    subject: `Your Parallax account at ${labName}`,
    text: [
      `Hello ${user.name},`,
      '',
      `An administrator of ${labName} has given you an account in Parallax, the laboratory's method verification desk.`,
      'Choose your password with this link (it works once and expires in 72 hours):',
      '',
      `${publicUrl}/set-password/${token}`,
      '',
      'If you did not expect this message, you can ignore it.',
    ].join('\n'),
  });
}

async function findValidLink(db: Executor, token: string) {
  const [row] = await db
    .select({ link: passwordLinks, user: users })
    .from(passwordLinks)
    .innerJoin(users, eq(users.id, passwordLinks.userId))
    .where(and(eq(passwordLinks.tokenHash, sha256Hex(token)), isNull(passwordLinks.usedAt), gt(passwordLinks.expiresAt, new Date())))
    .limit(1);
  if (!row || !row.user.active) throw new AppError('not_found', INVALID);
  return row;
}

export async function describeLink(db: Database, token: string): Promise<PasswordLinkInfo> {
  const { link, user } = await findValidLink(db, token);
  return { email: user.email, name: user.name, expiresAt: link.expiresAt.toISOString() };
}

export async function usePasswordLink(db: Database, token: string, password: string): Promise<void> {
  await db.transaction(async (tx) => {
    const { link, user } = await findValidLink(tx, token);
    await tx.update(passwordLinks).set({ usedAt: new Date() }).where(eq(passwordLinks.id, link.id));
    const [taken] = await tx.select({ id: users.id }).from(users).where(and(eq(users.email, user.email), ne(users.id, user.id), isNotNull(users.passwordHash))).limit(1);
    // Only the owner of the address (who holds the link) learns that it already has an account elsewhere.
    if (taken) throw new AppError('conflict', 'This e-mail address already has a Parallax account in another laboratory; ask the administrator who invited you to use another address');
    await updateUser(tx, user.id, { passwordHash: await hashPassword(password), failedSignIns: 0, lockedUntil: null });
    const ended = await endSessions(tx, user.id);
    await recordAudit(tx, { id: user.id, name: user.name, laboratoryId: user.laboratoryId }, {
      action: 'password.set-by-link', entity: 'user', entityId: user.id, after: { sessionsEnded: ended },
    });
  });
}
