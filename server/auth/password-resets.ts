import { recordAudit } from '../audit/audit';
import type { AppContext } from '../context';
import { findLaboratory, findUserByEmail } from './auth.repository';
import { newLinkToken, sendPasswordLink } from './password-links';
import { ownerScope } from '../db/lab-scope';

/**
 * "Forgot your password?": anyone may ask for a one-time link for an e-mail, and the answer never tells
 * whether the address has an account. Both ways run the same steps: a token is made and hashed, the
 * account is looked up, the request is audited (with the e-mail, for an unknown one too, in the history
 * of events without a laboratory). Only an active account's link is stored and its e-mail queued; the
 * e-mail leaves later through the outbox, so sending it never delays the answer.
 */
export async function requestPasswordReset(ctx: AppContext, email: string, address: string): Promise<void> {
  const made = newLinkToken();
  await ctx.db.transaction(async (tx) => {
    const user = await findUserByEmail(tx, email);
    const outcome = !user ? 'unknown e-mail' : !user.active ? 'inactive account' : 'link sent';
    if (user && user.active) {
      const lab = await findLaboratory(tx, ownerScope(user));
      await sendPasswordLink(tx, user, lab.name, ctx.config.publicUrl, { purpose: 'reset' }, made);
    }
    await recordAudit(tx, { id: null, name: null, laboratoryId: user?.laboratoryId ?? null }, {
      action: 'password-reset.requested', entity: 'user', entityId: user?.id ?? null, after: { email, address, outcome },
    });
  });
  ctx.mail.kick();
}
