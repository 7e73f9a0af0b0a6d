import ExcelJS from 'exceljs';
import { eq, sql, type SQL } from 'drizzle-orm';
import {
  CHANGE_TYPE_LABELS, RELEASE_CAUTION, RELEASE_STATE_LABELS, type ChangeType, type HistoryEvent, type ReleasePage, type ReleaseQuery, type ReleaseState,
  type ReleaseSummary, type Requirement,
} from '@shared/schemas';
import { describeEvent } from '@shared/types/audit-words';
import { laboratoryTime } from '@shared/types/lab-time';
import type { SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { labTimeZone, signedAndCreatedDays } from '../db/lab-zone';
import { auditEvents } from '../db/schema';
import { typedVerificationCode } from '../signoff/content-hash';
import { boardOf, findRelease, type Board } from './release-board';
import { scopeOf, type LabScope } from '../db/lab-scope';
import { labEvents } from '../audit/audit.repository';

/**
 * The releases of a laboratory, searchable like the archive: words in the title or note, a verification code as
 * printed, change type, state, analyte, instrument, signer and the laboratory's days of signing and creation.
 */
const BASE = sql`
  WITH found AS (
    SELECT r.*, a.name AS analyte_name, i.name AS instrument_name, u.name AS creator_name,
      sig.signer_id, sig.signer_name, sig.signed_at AS sig_at, sig.go_live_date, sig.verification_code
    FROM releases r
    JOIN analytes a ON a.id = r.analyte_id
    JOIN instruments i ON i.id = r.instrument_id
    JOIN users u ON u.id = r.created_by
    LEFT JOIN LATERAL (SELECT * FROM release_signatures g WHERE g.release_id = r.id ORDER BY g.id DESC LIMIT 1) sig ON true
  )`;

const SORTS: Record<ReleaseQuery['sort'], SQL> = {
  title: sql`title`, signedAt: sql`sig_at`, createdAt: sql`created_at`, state: sql`state`, changeType: sql`change_type`,
};

async function filters(db: Database, me: SignedInUser, q: ReleaseQuery): Promise<SQL> {
  const parts: SQL[] = [scopeOf(me).owns(sql`laboratory_id`)];
  if (q.changeType) parts.push(sql`change_type = ${q.changeType}`);
  if (q.state) parts.push(sql`state = ${q.state}`);
  if (q.analyteId) parts.push(sql`analyte_id = ${q.analyteId}`);
  if (q.instrumentId) parts.push(sql`${q.instrumentId} IN (instrument_id, comparative_instrument_id)`);
  if (q.signerId) parts.push(sql`signer_id = ${q.signerId}`);
  parts.push(...await signedAndCreatedDays(db, scopeOf(me), q, sql`sig_at`, sql`created_at`));
  if (q.q) {
    const code = typedVerificationCode(q.q);
    const byCode = code ? sql` OR EXISTS (SELECT 1 FROM release_signatures v WHERE v.release_id = found.id AND v.verification_code = ${code})` : sql``;
    parts.push(sql`(title ILIKE ${`%${q.q}%`} OR note ILIKE ${`%${q.q}%`} OR reagent_lot ILIKE ${`%${q.q}%`}${byCode})`);
  }
  return sql.join(parts, sql` AND `);
}

type Row = Record<string, unknown>;

/** A found row as the list shows it, with the board it was counted from. */
async function summary(db: Database, scope: LabScope, r: Row): Promise<{ summary: ReleaseSummary; board: Board }> {
  const release = await findRelease(db, scope, Number(r.id));
  const board = await boardOf(db, release);
  return { board, summary: {
    id: release.id, changeType: release.changeType as ChangeType, title: release.title, analyte: { id: release.analyteId, name: String(r.analyte_name) },
    instrument: { id: release.instrumentId, name: String(r.instrument_name) }, reagentLot: release.reagentLot, state: release.state as ReleaseState,
    met: board.requirements.filter((x) => x.status === 'met' || x.status === 'waived').length, required: (release.requirements as Requirement[]).length,
    signerName: (r.signer_name as string) ?? null, signedAt: r.sig_at ? new Date(r.sig_at as string).toISOString() : null, goLiveDate: (r.go_live_date as string) ?? null,
    verificationCode: (r.verification_code as string) ?? null, createdBy: { id: release.createdBy, name: String(r.creator_name) },
    createdAt: release.createdAt.toISOString(), updatedAt: release.updatedAt.toISOString(),
  } };
}

export async function searchReleases(db: Database, me: SignedInUser, q: ReleaseQuery): Promise<ReleasePage> {
  const where = await filters(db, me, q);
  const order = q.order === 'asc' ? sql`ASC NULLS LAST` : sql`DESC NULLS LAST`;
  const rows = await db.execute(sql`${BASE} SELECT * FROM found WHERE ${where} ORDER BY ${SORTS[q.sort]} ${order}, id DESC LIMIT ${q.pageSize} OFFSET ${(q.page - 1) * q.pageSize}`);
  const total = await db.execute(sql`${BASE} SELECT count(*)::int AS total FROM found WHERE ${where}`);
  const items: ReleaseSummary[] = [];
  for (const r of rows.rows as Row[]) items.push((await summary(db, scopeOf(me), r)).summary);
  return { items, total: Number((total.rows[0] as Row).total) };
}

/** The releases a search finds as a workbook: one row each, with its components, and the caution. */
export async function exportReleases(db: Database, me: SignedInUser, q: ReleaseQuery): Promise<Buffer> {
  const zone = await labTimeZone(db, scopeOf(me));
  const where = await filters(db, me, q);
  const rows = (await db.execute(sql`${BASE} SELECT * FROM found WHERE ${where} ORDER BY created_at DESC, id DESC LIMIT 5000`)).rows as Row[];
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Parallax';
  const ws = wb.addWorksheet('Releases');
  ws.columns = [
    { header: 'Release', key: 'id', width: 9 }, { header: 'Title', key: 'title', width: 40 }, { header: 'Change', key: 'change', width: 24 },
    { header: 'Analyte', key: 'analyte', width: 16 }, { header: 'Instrument', key: 'instrument', width: 20 }, { header: 'Reagent lot', key: 'lot', width: 14 },
    { header: 'State', key: 'state', width: 26 }, { header: 'Requirements met', key: 'met', width: 16 }, { header: 'Components (requirement: study, verification code)', key: 'components', width: 70 },
    { header: 'Signed by', key: 'signer', width: 20 }, { header: 'Signed', key: 'signed', width: 30 }, { header: 'Go-live', key: 'goLive', width: 12 },
    { header: 'Verification code', key: 'code', width: 18 }, { header: 'Created by', key: 'creator', width: 20 }, { header: 'Created', key: 'created', width: 30 },
  ];
  for (const r of rows) {
    const { summary: s, board } = await summary(db, scopeOf(me), r);
    ws.addRow({
      id: s.id, title: s.title, change: CHANGE_TYPE_LABELS[s.changeType], analyte: s.analyte.name, instrument: s.instrument.name, lot: s.reagentLot,
      state: RELEASE_STATE_LABELS[s.state], met: `${s.met} of ${s.required}`,
      components: board.requirements.map((x) => `${x.label}: ${x.study ? `study ${x.study.id}${x.study.verificationCode ? `, ${x.study.verificationCode}` : ''}` : x.waiver ? 'waived' : 'missing'}`).join('; '),
      signer: s.signerName ?? '', signed: s.signedAt ? laboratoryTime(s.signedAt, zone) : '', goLive: s.goLiveDate ?? '', code: s.verificationCode ?? '',
      creator: s.createdBy.name, created: laboratoryTime(s.createdAt, zone),
    });
  }
  ws.getRow(1).font = { bold: true };
  ws.addRow({});
  ws.addRow({ title: RELEASE_CAUTION });
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** A release's own history (every event recorded on it), oldest first. */
export async function releaseHistory(db: Database, me: SignedInUser, id: number): Promise<HistoryEvent[]> {
  await findRelease(db, scopeOf(me), id);
  const rows = await labEvents(db, scopeOf(me), eq(auditEvents.entity, 'release'), eq(auditEvents.entityId, String(id)));
  return rows.map((e) => ({ id: e.id, at: e.at.toISOString(), userId: e.userId, userName: e.userName, studyId: e.studyId, action: e.action, entity: e.entity, ...describeEvent(e) }));
}
