import type { ChangePasswordBody, Role, SessionUser } from '@shared/schemas';
import { recordAudit, type AuditInput } from '../audit/audit';
import type { Database, Executor } from '../db/client';
import { AppError } from '../http/app-error';
import { endSessions, findLaboratory, findUserByEmail, findUserById, updateUser } from './auth.repository';
import { afterFailure, isLocked } from './lockout';
import { checkPassword, hashPassword } from './passwords';
import { actorOf, SignedInUser } from './session-user';
import { scopeOf } from '../db/lab-scope';

export const WRONG_SIGN_IN = 'E-mail or password is wrong, or the account is locked or inactive';

type UserRow = NonNullable<Awaited<ReturnType<typeof findUserById>>>;
export const toSignedIn = (u: UserRow): SignedInUser =>
  ({ id: u.id, laboratoryId: u.laboratoryId, name: u.name, email: u.email, roles: u.roles as Role[] });

/**
 * Checks an e-mail and password. Every failure answers the same words, whether or not the e-mail
 * exists; the fifth failure in a row locks the account for 15 minutes. Each outcome is audited.
 */
export async function verifySignIn(db: Database, email: string, password: string, address: string): Promise<SignedInUser> {
  // The failure is audited and counted in a transaction that commits; the error is thrown after it.
  const outcome = await db.transaction(async (tx): Promise<SignedInUser | null> => {
    const user = await findUserByEmail(tx, email);
    const ok = await checkPassword(password, user?.passwordHash ?? null);
    if (!user) {
      await recordAudit(tx, { id: null, name: null, laboratoryId: null }, { action: 'sign-in.failed', entity: 'session', after: { email, address, why: 'unknown e-mail' } });
      return null;
    }
    const actor = { id: user.id, name: user.name, laboratoryId: user.laboratoryId };
    if (!user.active || isLocked(user.lockedUntil)) {
      await recordAudit(tx, actor, { action: 'sign-in.refused', entity: 'user', entityId: user.id, after: { address, why: user.active ? 'locked' : 'inactive' } });
      return null;
    }
    if (!ok) {
      await registerFailure(tx, user, address, 'sign-in');
      return null;
    }
    await updateUser(tx, user.id, { failedSignIns: 0, lockedUntil: null });
    await recordAudit(tx, actor, { action: 'sign-in', entity: 'session', entityId: user.id, after: { address } });
    return toSignedIn(user);
  });
  if (!outcome) throw new AppError('unauthenticated', WRONG_SIGN_IN);
  return outcome;
}

/**
 * Counts a wrong password (at sign-in or at signing) and locks the account at the fifth. The failure is
 * audited as `<where>.wrong-password` on the user, or, when `where` is a function (a refused signature),
 * as the event it makes from the count, e.g. on the study being signed.
 */
export async function registerFailure(tx: Executor, user: UserRow, address: string, where: string | ((failures: number) => AuditInput)): Promise<void> {
  const next = afterFailure(user.failedSignIns);
  await updateUser(tx, user.id, next);
  const actor = { id: user.id, name: user.name, laboratoryId: user.laboratoryId };
  await recordAudit(tx, actor, typeof where === 'function'
    ? where(next.failedSignIns)
    : { action: `${where}.wrong-password`, entity: 'user', entityId: user.id, after: { address, failures: next.failedSignIns } });
  if (next.lockedUntil) {
    await recordAudit(tx, actor, { action: 'user.locked', entity: 'user', entityId: user.id, after: { lockedUntil: next.lockedUntil.toISOString(), failures: next.failedSignIns } });
  }
}

/** Loads the current user for a session; an inactive user is signed out. */
export async function loadSessionUser(db: Database, id: number): Promise<SignedInUser | false> {
  const user = await findUserById(db, id);
  return user && user.active ? toSignedIn(user) : false;
}

export async function describeSession(db: Database, user: SignedInUser): Promise<SessionUser> {
  const lab = await findLaboratory(db, scopeOf(user));
  return { id: user.id, name: user.name, email: user.email, roles: user.roles, laboratory: { id: lab.id, name: lab.name, timeZone: lab.timeZone } };
}

/** Changes the signed-in user's password and ends their other sessions (a stolen session dies with the old password). */
export async function changeOwnPassword(db: Database, me: SignedInUser, body: ChangePasswordBody, address: string, currentSid: string): Promise<void> {
  await db.transaction(async (tx) => {
    const user = await findUserById(tx, me.id);
    if (!(await checkPassword(body.currentPassword, user.passwordHash))) {
      await registerFailure(tx, user, address, 'password-change');
      return 'wrong';
    }
    if (body.currentPassword === body.newPassword) throw new AppError('invalid_request', 'Choose a new password', [{ path: 'newPassword', message: 'The new password must differ from the current one' }]);
    await updateUser(tx, me.id, { passwordHash: await hashPassword(body.newPassword), failedSignIns: 0 });
    const ended = await endSessions(tx, me.id, currentSid);
    await recordAudit(tx, actorOf(me), { action: 'password.changed', entity: 'user', entityId: me.id, after: { otherSessionsEnded: ended } });
    return 'ok';
  }).then((r) => {
    if (r === 'wrong') throw new AppError('invalid_request', 'The current password is wrong', [{ path: 'currentPassword', message: 'The current password is wrong' }]);
  });
}
