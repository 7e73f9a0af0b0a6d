import type { Type } from '@angular/core';
import type { StudyKind } from '@shared/schemas';
import type { PlanRow, PlanStudy } from './plan-parts';
import type { OwnSettingsControls } from '../setup/setup-form-group';
import type { SetupGuidance } from '../setup/setup-guidance';
import type { SpecimenLayout } from '../specimens/specimen-layout';

/**
 * The client's half of a study kind (the shared half is its KindMeta in shared/kinds/<kind>/meta.ts): what it plugs
 * into the study pages. The registry is ./index.ts, one line per kind; the rest of the client asks it and never names a
 * kind. Which instruments a kind uses comes from its KindMeta (`instruments`).
 */
export interface KindView {
  kind: StudyKind;
  /** Its own Setup fields: a component with a `form` input (the SetupGroup) and a `catalog` input. */
  setupFields: Type<unknown>;
  /**
   * A panel under its Setup form, such as its plan before data: a component with `form` (the SetupGroup), `study` (null
   * for a new study) and `readonly` inputs, loaded when Setup shows it so its charts stay out of the Setup chunk.
   */
  setupPanel?: () => Promise<Type<unknown>>;
  /** What the shared Setup form says and shows for it (setup-guidance.ts). */
  guidance: SetupGuidance;
  /** The columns of its specimen grid (pasting, checks and saving follow them). */
  layout: SpecimenLayout;
  /**
   * Its Findings panel: a component with `study`, `analysis` and `results` inputs, loaded only when findings are shown,
   * so its charts stay out of the other chunks. A panel reads what it needs from its inputs and its own folder; it never
   * imports this registry.
   */
  findings: () => Promise<Type<unknown>>;
  /** The plan and acceptance criteria the review page lists, with the engine's settings where it has any. */
  planRows(study: PlanStudy): PlanRow[];
  /**
   * How the review page shows its findings: 'comparison-view' with the review's own comparison panels (verdict on top,
   * then the tables and plots), 'own-panel' with its Findings panel.
   */
  reviewPanel: 'comparison-view' | 'own-panel';
  /**
   * The Setup form's controls of its own settings (beyond StudySettings), built from the stored ones with the defaults
   * where missing; without it, each own setting gets one control checked with the kind's own schema.
   */
  settingsControls?: OwnSettingsControls;
}
