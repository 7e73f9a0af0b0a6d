import { SERVER_KINDS } from '../kinds';
import { sql, SQL } from 'drizzle-orm';
import type { ArchiveItem, ArchivePage, ArchiveQuery } from '@shared/schemas';
import type { SignedInUser } from '../auth/session-user';
import type { Database, Executor } from '../db/client';
import { signedAndCreatedDays } from '../db/lab-zone';
import { typedVerificationCode } from '../signoff/content-hash';
import { scopeOf } from '../db/lab-scope';

/**
 * The quality officer's search over every study of the laboratory. The verdict is read from the
 * signed analysis (or, before signing, the latest finished one): the worst decision-level verdict
 * for a comparison, accepted or failed for a verification, "established" for an establishment.
 */
const BASE = sql`
  WITH chosen AS (
    SELECT s.*, a.name AS analyte_name,
      sig.signer_name, sig.meaning, sig.signed_at AS sig_at, sig.signer_id,
      (SELECT an.results FROM analyses an WHERE an.id = COALESCE(sig.analysis_id,
         (SELECT max(x.id) FROM analyses x WHERE x.study_id = s.id AND x.purpose = 'findings' AND x.state = 'done'))) AS results,
      (SELECT count(*)::int FROM specimens sp WHERE sp.study_id = s.id AND NOT sp.excluded) AS n,
      concat_ws(' → ', ci.name, di.name, ii.name) AS instrument_names
    FROM studies s
    JOIN analytes a ON a.id = s.analyte_id
    LEFT JOIN instruments ci ON ci.id = s.comparative_instrument_id
    LEFT JOIN instruments di ON di.id = s.candidate_instrument_id
    LEFT JOIN instruments ii ON ii.id = s.instrument_id
    LEFT JOIN LATERAL (SELECT * FROM signatures g WHERE g.study_id = s.id AND g.meaning <> 'plan-approved' ORDER BY g.id DESC LIMIT 1) sig ON true
  ), judged AS (
    SELECT *, CASE
      WHEN results IS NULL THEN NULL
      ${sql.join(SERVER_KINDS.map((k) => sql`WHEN kind = ${k.meta.kind} THEN (${k.archiveVerdict})`), sql` `)}
      ELSE NULL END AS verdict
    FROM chosen
  )`;

const SORTS: Record<ArchiveQuery['sort'], SQL> = {
  title: sql`title`, signedAt: sql`sig_at`, createdAt: sql`created_at`, state: sql`state`, kind: sql`kind`,
};

async function filters(db: Database, me: SignedInUser, q: ArchiveQuery): Promise<SQL> {
  const parts: SQL[] = [scopeOf(me).owns(sql`laboratory_id`)];
  if (q.kind) parts.push(sql`kind = ${q.kind}`);
  if (q.state) parts.push(sql`state = ${q.state}`);
  if (q.analyteId) parts.push(sql`analyte_id = ${q.analyteId}`);
  if (q.instrumentId) parts.push(sql`${q.instrumentId} IN (comparative_instrument_id, candidate_instrument_id, instrument_id)`);
  if (q.verdict) parts.push(sql`verdict = ${q.verdict}`);
  if (q.signerId) parts.push(sql`signer_id = ${q.signerId}`);
  // Dates mean the laboratory's days.
  parts.push(...await signedAndCreatedDays(db, scopeOf(me), q, sql`sig_at`, sql`created_at`));
  if (q.q) {
    // The verification code printed on any of the study's signed PDFs finds it, typed as printed or not.
    const code = typedVerificationCode(q.q);
    const byCode = code ? sql` OR EXISTS (SELECT 1 FROM signatures v WHERE v.study_id = judged.id AND v.verification_code = ${code})` : sql``;
    parts.push(sql`(title ILIKE ${`%${q.q}%`} OR purpose ILIKE ${`%${q.q}%`}${byCode})`);
  }
  return sql.join(parts, sql` AND `);
}

type Row = Record<string, unknown>;
const item = (r: Row): ArchiveItem => ({
  id: Number(r.id), kind: r.kind as ArchiveItem['kind'], title: String(r.title), analyte: String(r.analyte_name), instruments: String(r.instrument_names ?? ''),
  state: r.state as ArchiveItem['state'], verdict: (r.verdict as ArchiveItem['verdict']) ?? null, signerId: (r.signer_id as number) ?? null, signerName: (r.signer_name as string) ?? null,
  meaning: (r.meaning as string) ?? null, signedAt: r.sig_at ? new Date(r.sig_at as string).toISOString() : null,
  createdAt: new Date(r.created_at as string).toISOString(), superseded: r.superseded_by_id !== null, supersedesId: (r.supersedes_id as number) ?? null, n: Number(r.n),
});

/** The given studies of a laboratory as the archive judges them (verdict, signer, n), in no set order. */
export async function judgedStudies(db: Executor, laboratoryId: number, ids: readonly number[]): Promise<ArchiveItem[]> {
  if (!ids.length) return [];
  const rows = await db.execute(sql`${BASE} SELECT * FROM judged WHERE laboratory_id = ${laboratoryId} AND id IN (${sql.join(ids.map((i) => sql`${i}`), sql`, `)})`);
  return (rows.rows as Row[]).map(item);
}

export async function searchArchive(db: Database, me: SignedInUser, q: ArchiveQuery): Promise<ArchivePage> {
  const where = await filters(db, me, q);
  const order = q.order === 'asc' ? sql`ASC NULLS LAST` : sql`DESC NULLS LAST`;
  const rows = await db.execute(sql`${BASE} SELECT * FROM judged WHERE ${where} ORDER BY ${SORTS[q.sort]} ${order}, id DESC LIMIT ${q.pageSize} OFFSET ${(q.page - 1) * q.pageSize}`);
  const total = await db.execute(sql`${BASE} SELECT count(*)::int AS total FROM judged WHERE ${where}`);
  return { items: (rows.rows as Row[]).map(item), total: Number((total.rows[0] as Row).total) };
}
