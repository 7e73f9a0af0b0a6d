import { StudySettings } from '../../shared/schemas';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Stored results with the words of the study's record-only settings that its findings show: a verification's
 * source of the stated interval. The source is no input of the engine (specimens/input-hash.ts, RECORD_ONLY), so
 * the stored results do not hold it (an analysis since that split stores an empty source); it is read from the
 * study as it stands wherever results are served or printed (GET /analyses/:id, the PDF, the export). A
 * record-only change thus shows at once while the findings stay current, and the stored results, which a
 * signature binds and a re-run compares, stay exactly as the engine made them. A signed study's settings no
 * longer change, so its findings show the source it was signed with.
 */
export function withRecordedWords(results: unknown, settings: unknown): unknown {
  if (!isObject(results) || results.kind !== 'verify-interval' || !isObject(results.stated)) return results;
  const source = StudySettings.parse(settings ?? {}).statedSource;
  return { ...results, stated: { ...results.stated, source } };
}
