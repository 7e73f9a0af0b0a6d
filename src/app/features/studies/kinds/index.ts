import type { StudyKind } from '@shared/schemas';
import type { KindView } from './kind-view';
import { methodComparisonView } from './method-comparison';
import { intervalEstablishView } from './interval-establish';
import { intervalVerifyView } from './interval-verify';
import { precisionView } from './precision';
import { reportableRangeView } from './reportable-range';

export type { KindView } from './kind-view';

/** The study kinds the client can show, one line each, in the order the kind chooser offers them. */
export const KIND_VIEWS: readonly KindView[] = [methodComparisonView, intervalEstablishView, intervalVerifyView, precisionView, reportableRangeView];

const BY_KIND = new Map<string, KindView>(KIND_VIEWS.map((v) => [v.kind, v]));

/** The kinds a new study may be created as: those with a view. */
export const SUPPORTED_KINDS: readonly StudyKind[] = KIND_VIEWS.map((v) => v.kind);

/** The view of a kind; a kind without one cannot be opened yet, which the page says in words. */
export function kindView(kind: StudyKind): KindView {
  const view = BY_KIND.get(kind);
  if (!view) throw new Error(`Parallax cannot show a study of kind "${kind}" yet.`);
  return view;
}

export function hasKindView(kind: StudyKind): boolean {
  return BY_KIND.has(kind);
}
