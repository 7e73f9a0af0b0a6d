import { eq } from 'drizzle-orm';
import type { SpecimenRow, SpecimenRows, StudySettings } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database, Tx } from '../db/client';
import { analytes, specimens } from '../db/schema';
import { repeatedLabels, repeatedLabelsSentence } from '@shared/types/repeated-labels';
import { plural } from '@shared/types/plural';
import { AppError } from '../http/app-error';
import { bumpVersion, findStudy, StudyRow } from '../studies/studies.repository';
import { assertEditable, assertPlanApproved } from '../studies/study-rules';
import { loadRows, StoredRow, storeInputHash } from './input-hash';
import { diffRows } from './row-diff';
import { CleanRow, validateRows } from './row-validation';
import { scopeOf } from '../db/lab-scope';

export const rowView = (r: StoredRow): SpecimenRow => ({
  position: r.position, label: r.label, comparative: r.comparative, candidate: r.candidate, value: r.value,
  comparativeText: r.comparativeText, candidateText: r.candidateText, valueText: r.valueText,
  sex: r.sex, ageBand: r.ageBand, excluded: r.excluded, exclusionReason: r.exclusionReason, note: r.note, uploadId: r.uploadId,
  // A kind's own fields (shared/kinds/kind.ts) sit beside the columns, as the grid and the exports read them.
  ...(r.extra ?? {}),
});

export const asClean = (r: StoredRow): CleanRow => ({
  label: r.label, comparative: r.comparative, candidate: r.candidate, value: r.value,
  comparativeText: r.comparativeText, candidateText: r.candidateText, valueText: r.valueText,
  sex: r.sex, ageBand: r.ageBand, excluded: r.excluded, exclusionReason: r.exclusionReason, note: r.note, extra: r.extra ?? null,
});

/**
 * The rows as the API answers them, with their warnings: labels that two or more included rows carry
 * (repeated-labels.ts; an excluded row's label is resolved and not counted).
 */
export function rowsAnswer(version: number, stored: StoredRow[]): SpecimenRows {
  const repeats = repeatedLabelsSentence(repeatedLabels(stored));
  const warnings = repeats ? [`${repeats}; give each specimen its own label, or exclude the extra rows with a reason`] : [];
  return { version, rows: stored.map(rowView), warnings };
}

export async function getRows(db: Database, me: SignedInUser, studyId: number): Promise<SpecimenRows> {
  const study = await findStudy(db, scopeOf(me), studyId);
  return rowsAnswer(study.version, await loadRows(db, study.id));
}

/**
 * Validates raw rows for a study, reading results with the study's decimal mark (settings.decimalMark);
 * a bad row answers 400 naming it, before anything is written.
 */
export async function cleanRowsFor(tx: Tx, study: StudyRow, raw: Record<string, unknown>[]): Promise<CleanRow[]> {
  const [analyte] = await tx.select().from(analytes).where(eq(analytes.id, study.analyteId));
  const decimalMark = (study.settings as Partial<StudySettings> | null)?.decimalMark ?? 'auto';
  const { rows, issues } = validateRows(study.kind, raw, analyte.canBeNegative, decimalMark);
  if (issues.length) {
    throw new AppError('invalid_request', issues.length === 1 ? issues[0].message : `${issues[0].message} (and ${plural(issues.length - 1, 'more problem', 'more problems')})`, issues);
  }
  return rows;
}

/**
 * Replaces the study's rows in the caller's transaction, bumping the version and auditing every
 * changed cell with its before and after value. `uploadIds` marks rows that came from a file.
 */
export async function writeRows(
  tx: Tx, me: SignedInUser, study: StudyRow, version: number, rows: CleanRow[], action: string, uploadIds: (number | null)[] = [],
): Promise<SpecimenRows> {
  assertEditable(study);
  await assertPlanApproved(tx, study);
  const before = await loadRows(tx, study.id);
  const updated = await bumpVersion(tx, study, version);
  await tx.delete(specimens).where(eq(specimens.studyId, study.id));
  const unchanged = (i: number) => !!before[i] && sameRow(asClean(before[i]), rows[i]);
  if (rows.length) {
    await tx.insert(specimens).values(rows.map((r, i) => ({
      ...r, studyId: study.id, position: i + 1,
      uploadId: uploadIds[i] ?? (unchanged(i) ? before[i].uploadId : null),
      enteredBy: unchanged(i) ? before[i].enteredBy : me.id,
    })));
  }
  await storeInputHash(tx, study.id);
  const diff = diffRows(before.map(asClean), rows);
  await recordAudit(tx, actorOf(me), {
    action, entity: 'specimens', entityId: study.id, studyId: study.id,
    before: { rowCount: before.length, version }, after: { rowCount: rows.length, version: updated.version, ...diff },
  });
  return rowsAnswer(updated.version, await loadRows(tx, study.id));
}

const sameRow = (a: CleanRow, b: CleanRow | undefined) => !!b && JSON.stringify(a) === JSON.stringify(b);

export async function putRows(db: Database, me: SignedInUser, studyId: number, version: number, raw: Record<string, unknown>[]): Promise<SpecimenRows> {
  return db.transaction(async (tx) => {
    const study = await findStudy(tx, scopeOf(me), studyId, true);
    assertEditable(study);
    const rows = await cleanRowsFor(tx, study, raw);
    return writeRows(tx, me, study, version, rows, 'specimens.saved');
  });
}
