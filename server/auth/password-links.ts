import { randomBytes } from 'node:crypto';
import { and, eq, gt, isNotNull, isNull, ne } from 'drizzle-orm';
import { RESET_LINK_HOURS, type PasswordLinkInfo, type PasswordLinkPurpose } from '@shared/schemas';
import { plural } from '@shared/types/plural';
import { recordAudit } from '../audit/audit';
import { sha256Hex } from '../audit/canonical-json';
import type { Database, Executor } from '../db/client';
import { labTimeZone } from '../db/lab-zone';
import { laboratoryTime } from '@shared/types/lab-time';
import { passwordLinks, users } from '../db/schema';
import { AppError } from '../http/app-error';
import { queueMail } from '../mail/outbox';
import { endSessions, updateUser } from './auth.repository';
import { hashPassword } from './passwords';
import { ownerScope } from '../db/lab-scope';

/** How long a link works: an invitation gives a new user time; a reset link is taken up at once or asked for again. */
export const LINK_HOURS: Record<PasswordLinkPurpose, number> = { invitation: 72, reset: RESET_LINK_HOURS };
const INVALID = 'This link is not valid or has expired; ask for a new one with “Forgot your password?” on the sign-in page, or ask your administrator';

/** A new one-time token and its SHA-256, the only form the database keeps. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: sha256Hex(token) };
}

interface LinkUser { id: number; name: string; email: string; laboratoryId: number }
export interface LinkOptions {
  purpose?: PasswordLinkPurpose;
  /** The administrator who sent a reset link (none: the user asked for it). */
  sender?: string;
}

function mailText(user: LinkUser, labName: string, link: string, o: Required<Pick<LinkOptions, 'purpose'>> & LinkOptions, until: string): { subject: string; text: string } {
  // The expiry in the laboratory's zone, named ("in 72 hours, at 2026-12-05 14:05 Europe/Lisbon (UTC+00:00)").
  const lasts = `${plural(LINK_HOURS[o.purpose], 'hour')}, at ${until}`;
  if (o.purpose === 'invitation') {
    return {
      subject: `Your Parallax account at ${labName}`,
      text: [
        `Hello ${user.name},`, '',
        `An administrator of ${labName} has given you an account in Parallax, the laboratory's method verification desk.`,
        `Choose your password with this link (it works once and expires in ${lasts}):`, '', link, '',
        'If you did not expect this message, you can ignore it.',
      ].join('\n'),
    };
  }
  return {
    subject: `A link to choose a new Parallax password (${labName})`,
    text: [
      `Hello ${user.name},`, '',
      o.sender
        ? `${o.sender}, an administrator of ${labName}, sent you a link to choose a new password for your Parallax account (${user.email}).`
        : `Someone, most likely you, asked for a link to choose a new password for your Parallax account at ${labName} (${user.email}).`,
      `Choose it with this link (it works once and expires in ${lasts}):`, '', link, '',
      'Choosing a new password signs you out of Parallax everywhere else.',
      o.sender ? 'Until you use the link, your password stays as it is.' : 'If you did not ask for this, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}

/**
 * Makes a one-time set-password link (only its hash is stored) and queues its e-mail. The user's older
 * links that are still unused stop working, so only the newest link in their mailbox does.
 */
export async function sendPasswordLink(
  tx: Executor, user: LinkUser, labName: string, publicUrl: string, options: LinkOptions = {}, made = newLinkToken(),
): Promise<void> {
  const purpose = options.purpose ?? 'invitation';
  const expiresAt = new Date(Date.now() + LINK_HOURS[purpose] * 3600_000);
  await tx.update(passwordLinks).set({ usedAt: new Date() }).where(and(eq(passwordLinks.userId, user.id), isNull(passwordLinks.usedAt)));
  await tx.insert(passwordLinks).values({ userId: user.id, tokenHash: made.tokenHash, purpose, expiresAt });
  const until = laboratoryTime(expiresAt, await labTimeZone(tx, ownerScope(user)));
  const { subject, text } = mailText(user, labName, `${publicUrl}/set-password/${made.token}`, { ...options, purpose }, until);
  await queueMail(tx, { laboratoryId: user.laboratoryId, to: [user.email], subject, text });
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
  return {
    email: user.email, name: user.name, expiresAt: link.expiresAt.toISOString(), purpose: link.purpose as PasswordLinkPurpose,
    timeZone: await labTimeZone(db, ownerScope(user)),
  };
}

/**
 * Sets the password once. It ends every session of the user (whoever held the old password is out) and
 * clears the failed-sign-in count and any lock. Answers the account's e-mail.
 */
export async function usePasswordLink(db: Database, token: string, password: string): Promise<string> {
  return db.transaction(async (tx) => {
    const { link, user } = await findValidLink(tx, token);
    await tx.update(passwordLinks).set({ usedAt: new Date() }).where(eq(passwordLinks.id, link.id));
    const [taken] = await tx.select({ id: users.id }).from(users).where(and(eq(users.email, user.email), ne(users.id, user.id), isNotNull(users.passwordHash))).limit(1);
    // Only the owner of the address (who holds the link) learns that it already has an account elsewhere.
    if (taken) throw new AppError('conflict', 'This e-mail address already has a Parallax account in another laboratory; ask the administrator who invited you to use another address');
    await updateUser(tx, user.id, { passwordHash: await hashPassword(password), failedSignIns: 0, lockedUntil: null });
    const ended = await endSessions(tx, user.id);
    const reset = link.purpose === 'reset';
    await recordAudit(tx, { id: user.id, name: user.name, laboratoryId: user.laboratoryId }, {
      action: reset ? 'password.reset' : 'password.set-by-link', entity: 'user', entityId: user.id,
      after: reset ? { sessionsEnded: ended, failedSignInsCleared: user.failedSignIns, wasLocked: !!user.lockedUntil && user.lockedUntil > new Date() } : { sessionsEnded: ended },
    });
    return user.email;
  });
}
