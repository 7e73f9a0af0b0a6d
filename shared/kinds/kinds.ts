import type { KindMeta } from './kind';
import { methodComparisonMeta } from './method-comparison/meta';
import { intervalEstablishMeta } from './interval-establish/meta';
import { intervalVerifyMeta } from './interval-verify/meta';
import { precisionMeta } from './precision/meta';
import { reportableRangeMeta } from './reportable-range/meta';

/**
 * The study kinds, one line each: what each says about itself to both sides (kind.ts). The server's registry
 * (server/kinds/index.ts) and the client's (src/app/features/studies/kinds/index.ts) add their halves.
 */
export const KIND_METAS = [methodComparisonMeta, intervalEstablishMeta, intervalVerifyMeta, precisionMeta, reportableRangeMeta] as const;

export type StudyKindName = (typeof KIND_METAS)[number]['kind'];

const BY_KIND = new Map<string, KindMeta>(KIND_METAS.map((m) => [m.kind, m]));

/** The description of a kind; throws for a name no kind has (callers have validated it with the StudyKind schema). */
export function kindMeta(kind: string): KindMeta {
  const meta = BY_KIND.get(kind);
  if (!meta) throw new Error(`There is no study kind "${kind}"`);
  return meta;
}
