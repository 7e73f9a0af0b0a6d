import { parseKindSettings } from '@shared/kinds/settings';
import { SERVER_KINDS } from '../kinds';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Stored results with the words of the study's record-only settings that its findings show (a verification's
 * source of the stated interval: server/kinds/interval-verify). Such words are no input of the engine
 * (specimens/input-hash.ts, RECORD_ONLY), so the stored results do not hold them; they are read from the study
 * as it stands wherever results are served or printed (GET /analyses/:id, the PDF, the export). A record-only
 * change thus shows at once while the findings stay current, and the stored results, which a signature binds and
 * a re-run compares, stay exactly as the engine made them. A signed study's settings no longer change, so its
 * findings show the words it was signed with.
 */
export function withRecordedWords(results: unknown, settings: unknown): unknown {
  if (!isObject(results)) return results;
  const kind = SERVER_KINDS.find((k) => k.meta.resultKind === results.kind);
  if (!kind?.recordedWords) return results;
  return kind.recordedWords(results, parseKindSettings(kind.meta.kind, settings ?? {}));
}
