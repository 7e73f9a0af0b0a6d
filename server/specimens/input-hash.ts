import { asc, eq } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { specimens } from '../db/schema';
import { canonicalJson, sha256Hex } from '../audit/canonical-json';
import type { StudyRow } from '../studies/studies.repository';

export type StoredRow = typeof specimens.$inferSelect;

export const loadRows = (db: Executor, studyId: number): Promise<StoredRow[]> =>
  db.select().from(specimens).where(eq(specimens.studyId, studyId)).orderBy(asc(specimens.position));

/** What an analysis reads of a row; the input hash covers exactly this. */
export const analysedFields = (r: StoredRow) => ({
  position: r.position, label: r.label,
  comparative: r.comparative, candidate: r.candidate, value: r.value,
  comparativeText: r.comparativeText, candidateText: r.candidateText, valueText: r.valueText,
  sex: r.sex, ageBand: r.ageBand, excluded: r.excluded, exclusionReason: r.exclusionReason,
});

export interface AnalysisInput { kind: string; settings: unknown; rows: ReturnType<typeof analysedFields>[] }

/**
 * Settings that are not inputs of the engine: words for people, and how results are read on entry
 * (decimalMark: the rows it produced are hashed themselves). Changing them leaves the findings current.
 */
const RECORD_ONLY = ['allowableBiasSource', 'comparativeLot', 'candidateLot', 'reagentLot', 'runsFrom', 'runsTo', 'plannedSpecimens',
  'outlierRule', 'acceptanceRule', 'populationDescription', 'statedSource', 'decimalMark'];

export const analysedSettings = (settings: unknown): Record<string, unknown> =>
  Object.fromEntries(Object.entries((settings ?? {}) as Record<string, unknown>).filter(([k]) => !RECORD_ONLY.includes(k)));

export async function analysisInput(db: Executor, study: StudyRow): Promise<AnalysisInput> {
  return { kind: study.kind, settings: analysedSettings(study.settings), rows: (await loadRows(db, study.id)).map(analysedFields) };
}

/** SHA-256 of canonical JSON of rows and settings: findings are current when their hash equals this. */
export const inputHash = (input: AnalysisInput): string => sha256Hex(canonicalJson(input));

export async function studyInputHash(db: Executor, study: StudyRow): Promise<string> {
  return inputHash(await analysisInput(db, study));
}
