import { eq } from 'drizzle-orm';
import {
  CHANGE_TYPE_LABELS, CHANGE_TYPES, type ChangeType, type DueRule, type ReleaseTemplate, type Requirement, type UpdateTemplateBody,
} from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, type SignedInUser } from '../auth/session-user';
import type { Database, Executor } from '../db/client';
import { releaseTemplates } from '../db/schema';
import { AppError } from '../http/app-error';
import { scopeOf, type LabScope } from '../db/lab-scope';
import { labTemplateRow, labTemplateRows } from './releases.repository';

/**
 * What each change type requires until the laboratory's administrator changes it, with the rule each follows.
 * Sources as in the design notes (DOMAIN.md): 42 CFR 493.1253(b)(1) for what a new system verifies [memory],
 * CLSI EP26 practice for reagent lots, common practice for a relocated instrument; re-verification by
 * 42 CFR 493.1281 (comparability twice a year), 42 CFR 493.1255(b)(3) (calibration verification every six months),
 * and ISO 15189 (periodic review of reference intervals; yearly is common practice).
 */
export const DEFAULT_TEMPLATES: Record<ChangeType, { requirements: Requirement[]; dueRules: DueRule[] }> = {
  'new-system': {
    requirements: [
      { key: 'comparison', label: 'Method comparison', kinds: ['method-comparison'], rule: 'Accuracy against the current method with patient specimens (42 CFR 493.1253(b)(1); CLSI EP09 practice)' },
      { key: 'precision', label: 'Precision', kinds: ['precision'], rule: 'Repeatability and within-laboratory precision against the claims (42 CFR 493.1253(b)(1); CLSI EP15 practice)' },
      { key: 'reportable-range', label: 'Reportable range', kinds: ['reportable-range'], rule: 'The measuring interval the laboratory reports (42 CFR 493.1253(b)(1))' },
      { key: 'reference-interval', label: 'Reference interval', kinds: ['interval-verify', 'interval-establish'], rule: 'The reference interval fits the laboratory\'s population: verified with 20 or established with 120+ (42 CFR 493.1253(b)(1); CLSI EP28 practice)' },
    ],
    dueRules: [
      { key: 'comparability', label: 'Comparability across instruments', months: 6, rule: 'The same test on different instruments or sites compared twice a year (42 CFR 493.1281)', kinds: ['method-comparison'] },
      { key: 'calibration-verification', label: 'Calibration verification', months: 6, rule: 'At least every six months (42 CFR 493.1255(b)(3))', kinds: ['reportable-range'] },
      { key: 'interval-review', label: 'Reference interval review', months: 12, rule: 'Periodic review of reference intervals (ISO 15189; yearly is common practice)', kinds: ['interval-verify', 'interval-establish'] },
    ],
  },
  'reagent-lot': {
    requirements: [
      { key: 'lot-comparison', label: 'New lot against current lot', kinds: ['method-comparison'], rule: 'Patient specimens measured with both lots (CLSI EP26 practice)' },
    ],
    dueRules: [],
  },
  relocation: {
    requirements: [
      { key: 'precision', label: 'Precision after the move', kinds: ['precision'], rule: 'Precision checked at the new site (common practice)' },
      { key: 'comparison', label: 'Patient specimens before and after the move', kinds: ['method-comparison'], rule: 'A small comparison of patient specimens (common practice)' },
    ],
    dueRules: [
      { key: 'comparability', label: 'Comparability across instruments', months: 6, rule: 'The same test on different instruments or sites compared twice a year (42 CFR 493.1281)', kinds: ['method-comparison'] },
    ],
  },
  custom: { requirements: [], dueRules: [] },
};

type Row = typeof releaseTemplates.$inferSelect;

const view = (changeType: ChangeType, row: Row | undefined): ReleaseTemplate => ({
  changeType,
  label: CHANGE_TYPE_LABELS[changeType],
  requirements: (row?.requirements as Requirement[]) ?? DEFAULT_TEMPLATES[changeType].requirements,
  dueRules: ((row?.dueRules as DueRule[]) ?? DEFAULT_TEMPLATES[changeType].dueRules).map((r) => ({ ...r, kinds: r.kinds ?? [] })),
  version: row?.version ?? 0,
  updatedAt: row?.updatedAt.toISOString() ?? null,
});

/** The laboratory's template of one change type: its own when the administrator saved one, else the default (version 0). */
export async function templateOf(db: Executor, scope: LabScope, changeType: ChangeType): Promise<ReleaseTemplate> {
  return view(changeType, await labTemplateRow(db, scope, changeType));
}

export async function listTemplates(db: Executor, me: SignedInUser): Promise<ReleaseTemplate[]> {
  const rows = await labTemplateRows(db, scopeOf(me));
  return CHANGE_TYPES.map((t) => view(t, rows.find((r) => r.changeType === t)));
}

/** The administrator saves a template (version 0 for the first save over the default); audited with before and after. */
export function saveTemplate(db: Database, me: SignedInUser, changeType: ChangeType, body: UpdateTemplateBody): Promise<ReleaseTemplate> {
  return db.transaction(async (tx) => {
    const row = await labTemplateRow(tx, scopeOf(me), changeType, true);
    const before = view(changeType, row);
    if (before.version !== body.version) {
      throw new AppError('conflict', `This template was changed meanwhile (version ${before.version}, not ${body.version}); open it again`);
    }
    const values = { requirements: body.requirements, dueRules: body.dueRules, updatedBy: me.id, updatedAt: new Date() };
    const [saved] = row
      ? await tx.update(releaseTemplates).set({ ...values, version: row.version + 1 }).where(eq(releaseTemplates.id, row.id)).returning()
      : await tx.insert(releaseTemplates).values(scopeOf(me).values({ ...values, changeType, version: 1 })).returning();
    await recordAudit(tx, actorOf(me), {
      action: 'release-template.updated', entity: 'release-template', entityId: changeType,
      before: { requirements: before.requirements, dueRules: before.dueRules }, after: { requirements: body.requirements, dueRules: body.dueRules },
    });
    return view(changeType, saved);
  });
}
