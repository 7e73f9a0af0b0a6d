import type { SpecimenRow, StudyKind, StudyState } from '@shared/schemas';
import type { KindSettings } from '@shared/kinds/settings';
import type { ComparisonResult, EngineInfo, IntervalResult, VerifyIntervalResult } from '@shared/stats';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';

/**
 * Everything the verification PDF prints, as plain data: the renderer does no I/O and reads no clock,
 * so the same StudyReport always gives the same bytes. The server builds it from the database at
 * signing (or for a DRAFT preview); times are Date objects, printed in the laboratory's time zone.
 */
export interface StudyReport {
  laboratory: { name: string; timeZone: string };
  study: { id: number; kind: StudyKind; title: string; purpose: string; state: StudyState; supersedesId: number | null };
  analyte: { name: string; unit: string };
  instruments: { comparative?: InstrumentInfo; candidate?: InstrumentInfo; instrument?: InstrumentInfo };
  /** The common settings and the kind's own (shared/kinds/settings.ts). */
  settings: KindSettings;
  engineVersion: string;
  rows: ReportRow[];
  /** The stored analysis results for the study's kind, or null when there is no current analysis. */
  results: ReportResults | null;
  amendments: Amendment[];
  planApproval?: PlanApproval | null;
  /**
   * A method comparison's plan by simulation: the finished run of the plan as it is set now (currentPlanRun), or
   * null when there is none. Whether a plan is set at all is `settings.samplePlan`; set but not run (or run for
   * other settings), the report says so.
   */
  samplePlan?: ReportSamplePlan | null;
  signature?: ReportSignature | null;
  /** SHA-256 of the signed content, 64 hex digits. */
  contentHash: string;
  verificationCode: string;
  draft: boolean;
  generatedAt: Date;
}

export interface InstrumentInfo { name: string; model: string; serial: string }

/** A stored specimen row; the *Text fields, when given, keep the precision as reported. */
export type ReportRow = Pick<SpecimenRow,
  'position' | 'label' | 'comparative' | 'candidate' | 'value' | 'sex' | 'ageBand' | 'excluded' | 'exclusionReason' | 'note'
> & Partial<Pick<SpecimenRow, 'comparativeText' | 'candidateText' | 'valueText'>> & {
  /** A kind's own row fields (a precision row's material, day, replicate), as GET /specimens answers them. */
  readonly [kindField: string]: unknown;
};

/** A criterion changed after the plan was approved. */
export interface Amendment { at: Date; by: string; field: string; from: string; to: string; reason: string }

export interface PlanApproval { signerName: string; signedAt: Date; comment: string }

/** A run of the plan: the plan it simulated, its figures, and when it finished. */
export interface ReportSamplePlan { plan: SamplePlan; results: ComparisonPlanResult; runId: number; finishedAt: Date }

export interface ReportSignature { signerName: string; meaning: 'accepted' | 'not-accepted'; comment: string; signedAt: Date }

/** The server adds grid positions to the engine's 1-based row numbers. */
export type ComparisonFindings = ComparisonResult & { outlierPositions?: number[] };
export type EstablishFindings = IntervalResult & { outlierPositions?: number[] };
export type VerifyFindings = VerifyIntervalResult & {
  excludedCount?: number;
  outsidePositions?: number[];
  stated?: { lower: number; upper: number; source: string };
  caution?: string;
  engine?: EngineInfo;
};
export type ReportResults = ComparisonFindings | EstablishFindings | VerifyFindings;
