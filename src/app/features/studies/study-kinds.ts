import { Type } from '@angular/core';
import type { StudyKind } from '../../../../shared/schemas';
import { ComparisonSetupFields } from './setup/comparison-setup-fields/comparison-setup-fields';
import { COMPARISON_LAYOUT, SpecimenLayout } from './specimens/specimen-layout';
import { INTERVAL_LAYOUT } from './intervals/interval-layout';
import { EstablishSetupFields } from './intervals/setup/establish-setup-fields';
import { VerifySetupFields } from './intervals/setup/verify-setup-fields';
import { ESTABLISH_GUIDANCE, VERIFY_GUIDANCE } from './intervals/setup/interval-plans';
import { COMPARISON_GUIDANCE, type SetupGuidance } from './setup/setup-guidance';

/**
 * What a kind of study plugs into the study page: its own Setup fields (a component with a `form` input,
 * the SetupGroup, and a `catalog` input), the columns of its specimen grid, and its Findings panel
 * (a component with `study` and `analysis` inputs, loaded only when the Findings tab opens, so its charts
 * stay out of the other chunks), and what the shared Setup form says and shows for it (setup-guidance.ts).
 * The reference-interval kinds add their entries here.
 */
export interface StudyKindView {
  setupFields: Type<unknown>;
  guidance: SetupGuidance;
  layout: SpecimenLayout;
  findings: () => Promise<Type<unknown>>;
}

const VIEWS: Partial<Record<StudyKind, StudyKindView>> = {
  'method-comparison': {
    setupFields: ComparisonSetupFields,
    guidance: COMPARISON_GUIDANCE,
    layout: COMPARISON_LAYOUT,
    findings: () => import('./findings/comparison/comparison-findings').then((m) => m.ComparisonFindings),
  },
  'interval-establish': {
    setupFields: EstablishSetupFields,
    guidance: ESTABLISH_GUIDANCE,
    layout: INTERVAL_LAYOUT,
    findings: () => import('./intervals/findings/establish-findings').then((m) => m.EstablishFindings),
  },
  'interval-verify': {
    setupFields: VerifySetupFields,
    guidance: VERIFY_GUIDANCE,
    layout: INTERVAL_LAYOUT,
    findings: () => import('./intervals/findings/verify-findings').then((m) => m.VerifyFindings),
  },
};

/** The kinds a new study may be created as: those with a view. */
export const SUPPORTED_KINDS = Object.keys(VIEWS) as StudyKind[];

/** The view of a kind; a kind without one cannot be opened yet, which the page says in words. */
export function kindView(kind: StudyKind): StudyKindView {
  const view = VIEWS[kind];
  if (!view) throw new Error(`Parallax cannot show a study of kind "${kind}" yet.`);
  return view;
}

export function hasKindView(kind: StudyKind): boolean {
  return VIEWS[kind] !== undefined;
}
