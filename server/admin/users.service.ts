import type { InviteUserBody, UpdateUserBody, User } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { findLaboratory, findUserInLab, findUserInLabByEmail, updateUser } from '../auth/auth.repository';
import { sendPasswordLink } from '../auth/password-links';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import { users } from '../db/schema';
import { AppError, invalid, notFound } from '../http/app-error';
import { listUsers } from './admin.repository';
import { userView } from './views';
import { scopeOf } from '../db/lab-scope';

export async function listLabUsers(ctx: AppContext, me: SignedInUser): Promise<User[]> {
  return (await listUsers(ctx.db, scopeOf(me))).map(userView);
}

export async function inviteUser(ctx: AppContext, me: SignedInUser, body: InviteUserBody): Promise<User> {
  const user = await ctx.db.transaction(async (tx) => {
    // Only this laboratory's own users are looked at: whether the e-mail has an account elsewhere is not
    // revealed (the invitation is sent the same way; only the link's holder learns it, when using it).
    if (await findUserInLabByEmail(tx, scopeOf(me), body.email)) throw invalid('email', 'A user with this e-mail already exists in this laboratory');
    const [row] = await tx.insert(users).values(scopeOf(me).values({ name: body.name, email: body.email, roles: body.roles })).returning();
    const lab = await findLaboratory(tx, scopeOf(me));
    await sendPasswordLink(tx, row, lab.name, ctx.config.publicUrl);
    await recordAudit(tx, actorOf(me), { action: 'user.invited', entity: 'user', entityId: row.id, after: userView(row) });
    return row;
  });
  ctx.mail.kick();
  return userView(user);
}

async function changeUser(ctx: AppContext, me: SignedInUser, id: number, action: string, patch: (u: typeof users.$inferSelect) => Partial<typeof users.$inferInsert>) {
  return ctx.db.transaction(async (tx) => {
    const before = await findUserInLab(tx, scopeOf(me), id);
    if (!before) throw notFound('User');
    const after = await updateUser(tx, id, patch(before));
    await recordAudit(tx, actorOf(me), { action, entity: 'user', entityId: id, before: userView(before), after: userView(after) });
    return userView(after);
  });
}

export function updateLabUser(ctx: AppContext, me: SignedInUser, id: number, body: UpdateUserBody): Promise<User> {
  if (id === me.id && (body.active === false || (body.roles && !body.roles.includes('admin')))) {
    throw new AppError('invalid_request', 'You cannot deactivate yourself or remove your own administrator role', [
      { path: body.active === false ? 'active' : 'roles', message: 'Ask another administrator to do this' },
    ]);
  }
  return changeUser(ctx, me, id, 'user.updated', () => body);
}

export const unlockLabUser = (ctx: AppContext, me: SignedInUser, id: number): Promise<User> =>
  changeUser(ctx, me, id, 'user.unlocked', () => ({ failedSignIns: 0, lockedUntil: null }));

export async function resendInvitation(ctx: AppContext, me: SignedInUser, id: number): Promise<void> {
  await ctx.db.transaction(async (tx) => {
    const user = await findUserInLab(tx, scopeOf(me), id);
    if (!user) throw notFound('User');
    if (!user.active) throw new AppError('conflict', 'This user is deactivated; reactivate them first');
    const lab = await findLaboratory(tx, scopeOf(me));
    await sendPasswordLink(tx, user, lab.name, ctx.config.publicUrl);
    await recordAudit(tx, actorOf(me), { action: 'user.link-sent', entity: 'user', entityId: id });
  });
  ctx.mail.kick();
}

/** An administrator sends a user a one-time link (1 hour) to choose a new password; older unused links stop working. */
export async function sendPasswordReset(ctx: AppContext, me: SignedInUser, id: number): Promise<void> {
  await ctx.db.transaction(async (tx) => {
    const user = await findUserInLab(tx, scopeOf(me), id);
    if (!user) throw notFound('User');
    if (!user.active) throw new AppError('invalid_request', `${user.name} is deactivated; reactivate the account before sending a password link`);
    if (!user.passwordHash) throw new AppError('invalid_request', `${user.name} has not chosen a password yet; send the invitation again instead`);
    const lab = await findLaboratory(tx, scopeOf(me));
    await sendPasswordLink(tx, user, lab.name, ctx.config.publicUrl, { purpose: 'reset', sender: me.name });
    await recordAudit(tx, actorOf(me), { action: 'password-reset.sent', entity: 'user', entityId: id, after: { email: user.email } });
  });
  ctx.mail.kick();
}
