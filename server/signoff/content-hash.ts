import { eq } from 'drizzle-orm';
import { canonicalJson, sha256Hex } from '../audit/canonical-json';
import type { Executor } from '../db/client';
import { analyses } from '../db/schema';
import { loadRows, analysedFields } from '../specimens/input-hash';
import type { StudyRow } from '../studies/studies.repository';

/**
 * What a signature binds: the study's identity and settings, every row (with notes and exclusion
 * reasons), the results of the signed analysis and the engine version, as canonical JSON.
 */
export async function signedContent(db: Executor, study: StudyRow, analysisId: number) {
  const [analysis] = await db.select().from(analyses).where(eq(analyses.id, analysisId));
  const rows = (await loadRows(db, study.id)).map((r) => ({ ...analysedFields(r), note: r.note }));
  return {
    study: {
      id: study.id, kind: study.kind, title: study.title, purpose: study.purpose, analyteId: study.analyteId,
      comparativeInstrumentId: study.comparativeInstrumentId, candidateInstrumentId: study.candidateInstrumentId,
      instrumentId: study.instrumentId, supersedesId: study.supersedesId,
    },
    settings: study.settings,
    rows,
    analysis: { id: analysis.id, inputHash: analysis.inputHash, seed: analysis.seed, resamples: analysis.resamples },
    results: analysis.results,
    engineVersion: analysis.engineVersion,
  };
}

export const contentHashOf = (content: unknown): string => sha256Hex(canonicalJson(content));

const ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';
/** A short code for people to quote: PX- and 8 characters from the hash (no 0/O, 1/I). */
export function verificationCode(hash: string): string {
  let bits = BigInt(`0x${hash.slice(0, 12)}`);
  let out = '';
  for (let i = 0; i < 8; i++) {
    out = ALPHABET[Number(bits & 31n)] + out;
    bits >>= 5n;
  }
  return `PX-${out.slice(0, 4)}-${out.slice(4)}`;
}

/**
 * A verification code as a person may type it back, in its printed form ("PX-7K3M-Q9TD"): case,
 * spaces and separators do not matter, and the "PX" may be left out. Null when the text cannot be a code.
 */
export function typedVerificationCode(text: string): string | null {
  let key = text.toUpperCase().replace(/[^A-Z0-9]/g, '');
  if (key.length === 10 && key.startsWith('PX')) key = key.slice(2);
  if (key.length !== 8 || [...key].some((c) => !ALPHABET.includes(c))) return null;
  return `PX-${key.slice(0, 4)}-${key.slice(4)}`;
}
