import type { ServerKind } from './kind';
import { methodComparisonKind } from './method-comparison';
import { intervalEstablishKind } from './interval-establish';
import { intervalVerifyKind } from './interval-verify';
import { precisionKind } from './precision';
import { reportableRangeKind } from './reportable-range';

/** The server's study kinds, one line each (kind.ts); the shared descriptions are in shared/kinds/kinds.ts. */
export const SERVER_KINDS: readonly ServerKind[] = [methodComparisonKind, intervalEstablishKind, intervalVerifyKind, precisionKind, reportableRangeKind];

const BY_KIND = new Map(SERVER_KINDS.map((k) => [k.meta.kind, k]));

/** The server module of a kind; a name no kind has is an error in words (stored data from a newer version, say). */
export function serverKind(kind: string): ServerKind {
  const found = BY_KIND.get(kind);
  if (!found) throw new Error(`Studies of kind ${kind} cannot be handled by this version of Parallax`);
  return found;
}
