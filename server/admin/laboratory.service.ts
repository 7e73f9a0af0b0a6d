import type { LaboratorySettings } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { findLaboratory } from '../auth/auth.repository';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { laboratories } from '../db/schema';
import { invalid } from '../http/app-error';
import { scopeOf } from '../db/lab-scope';

const view = (l: typeof laboratories.$inferSelect): LaboratorySettings & { name: string } =>
  ({ name: l.name, timeZone: l.timeZone, planApprovalRequired: l.planApprovalRequired, allowSelfSign: l.allowSelfSign });

export async function getLaboratory(db: Database, me: SignedInUser) {
  return view(await findLaboratory(db, scopeOf(me)));
}

/** The laboratory's rules: time zone, plan approval before data, and self-signing for a one-person laboratory (audited). */
export async function updateLaboratory(db: Database, me: SignedInUser, body: LaboratorySettings) {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: body.timeZone });
  } catch {
    throw invalid('timeZone', `"${body.timeZone}" is not a time zone name such as Europe/Lisbon`);
  }
  return db.transaction(async (tx) => {
    const before = await findLaboratory(tx, scopeOf(me));
    const [after] = await tx.update(laboratories).set(body).where(scopeOf(me).owns(laboratories.id)).returning();
    await recordAudit(tx, actorOf(me), { action: 'laboratory.updated', entity: 'laboratory', entityId: before.id, before: view(before), after: view(after) });
    return view(after);
  });
}
