import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { specimens, studies } from '../db/schema';
import { canonicalJson, sha256Hex } from '../audit/canonical-json';
import type { StudyRow } from '../studies/studies.repository';
import { kindMeta } from '@shared/kinds/kinds';

export type StoredRow = typeof specimens.$inferSelect;

export const loadRows = (db: Executor, studyId: number): Promise<StoredRow[]> =>
  db.select().from(specimens).where(eq(specimens.studyId, studyId)).orderBy(asc(specimens.position));

/**
 * What an analysis reads of a row; the input hash covers exactly this. A kind's own fields (`extra`) are added
 * only where a row has them, so the rows of kinds without them hash as they always did.
 */
export const analysedFields = (r: AnalysedSource) => ({
  position: r.position, label: r.label,
  comparative: r.comparative, candidate: r.candidate, value: r.value,
  comparativeText: r.comparativeText, candidateText: r.candidateText, valueText: r.valueText,
  sex: r.sex, ageBand: r.ageBand, excluded: r.excluded, exclusionReason: r.exclusionReason,
  ...(r.extra ? { extra: r.extra } : {}),
}) as AnalysedRow;

/** What a row is read from: a stored row, or a checked one with its position (the CLI's). */
type AnalysedSource = Omit<AnalysedRow, 'extra'> & { extra: Record<string, string | number | null> | null };

/** An analysed row; `extra` only for kinds with fields of their own. */
export interface AnalysedRow {
  position: number; label: string; comparative: number | null; candidate: number | null; value: number | null;
  comparativeText: string | null; candidateText: string | null; valueText: string | null;
  sex: string | null; ageBand: string | null; excluded: boolean; exclusionReason: string | null;
  extra?: Record<string, string | number | null>;
}

export interface AnalysisInput { kind: string; settings: unknown; rows: AnalysedRow[] }

/**
 * Settings that are not inputs of the engine: words for people, and how results are read on entry
 * (decimalMark: the rows it produced are hashed themselves). Changing them leaves the findings current.
 */
const RECORD_ONLY = ['allowableBiasSource', 'comparativeLot', 'candidateLot', 'reagentLot', 'runsFrom', 'runsTo', 'plannedSpecimens',
  'outlierRule', 'acceptanceRule', 'populationDescription', 'statedSource', 'decimalMark'];

/** The settings an analysis reads: all but the record-only ones, those of every study and the kind's own (KindMeta.recordOnly). */
export const analysedSettings = (settings: unknown, kind: string): Record<string, unknown> => {
  const own = kindMeta(kind).recordOnly ?? [];
  return Object.fromEntries(Object.entries((settings ?? {}) as Record<string, unknown>).filter(([k]) => !RECORD_ONLY.includes(k) && !own.includes(k)));
};

export async function analysisInput(db: Executor, study: StudyRow): Promise<AnalysisInput> {
  return { kind: study.kind, settings: analysedSettings(study.settings, study.kind), rows: (await loadRows(db, study.id)).map(analysedFields) };
}

/** SHA-256 of canonical JSON of rows and settings: findings are current when their hash equals this. */
export const inputHash = (input: AnalysisInput): string => sha256Hex(canonicalJson(input));

/** The hash of the study's rows and settings as they are now, computed from the rows (integrity checks use this). */
export async function studyInputHash(db: Executor, study: StudyRow): Promise<string> {
  return inputHash(await analysisInput(db, study));
}

const includedOf = (input: AnalysisInput): number => input.rows.filter((r) => !r.excluded).length;

/**
 * Writes the study's input hash and included count in the caller's transaction, after the rows or
 * settings changed (a trigger has cleared the old hash; see migration 0007). Returns the hash.
 */
export async function storeInputHash(tx: Executor, studyId: number): Promise<string> {
  const [study] = await tx.select().from(studies).where(eq(studies.id, studyId));
  const input = await analysisInput(tx, study);
  const hash = inputHash(input);
  await tx.update(studies).set({ inputHash: hash, includedCount: includedOf(input) }).where(eq(studies.id, studyId));
  return hash;
}

/**
 * The study's input hash and included count for reads: the stored ones, or (where a trigger cleared them,
 * or a study predates them) computed from the rows and stored for the next read. The store only lands when
 * the study is still at the version that was read and still has no hash, so a concurrent change is never
 * overwritten.
 */
export async function knownInput(db: Executor, study: StudyRow): Promise<{ hash: string; included: number }> {
  if (study.inputHash && study.includedCount !== null) return { hash: study.inputHash, included: study.includedCount };
  const input = await analysisInput(db, study);
  const known = { hash: inputHash(input), included: includedOf(input) };
  await db.update(studies).set({ inputHash: known.hash, includedCount: known.included })
    .where(and(eq(studies.id, study.id), eq(studies.version, study.version), isNull(studies.inputHash)));
  return known;
}

export const knownInputHash = async (db: Executor, study: StudyRow): Promise<string> => (await knownInput(db, study)).hash;

/** Fills in the hashes not yet known (after the migration that added them), a batch at a time. */
export async function backfillInputHashes(db: Executor, batch = 200): Promise<number> {
  let done = 0;
  let after = 0;
  for (;;) {
    const rows = await db.select().from(studies).where(and(isNull(studies.inputHash), gt(studies.id, after))).orderBy(asc(studies.id)).limit(batch);
    if (!rows.length) return done;
    for (const r of rows) {
      await knownInputHash(db, r);
      after = r.id;
      done++;
    }
  }
}
