import type { ComparisonPlanOptions } from '@shared/stats/plan-comparison';
import { canonicalJson, sha256Hex } from '../audit/canonical-json';

/**
 * What a plan run (an analysis with purpose 'plan') stores as its input: the engine's plan options, built from
 * the study's settings (and an earlier study's comparative values) when it was queued. Run by the same queue and
 * worker threads as findings (analysis-jobs.ts, run-analysis.ts).
 */
export interface PlanInput { kind: 'plan-comparison'; plan: ComparisonPlanOptions }

export const isPlanInput = (input: unknown): input is PlanInput => (input as { kind?: unknown } | null)?.kind === 'plan-comparison';

/** SHA-256 of the canonical JSON of the input: the plan is current when its run's hash equals this. */
export const planInputHash = (input: PlanInput): string => sha256Hex(canonicalJson(input));

/** SHA-256 of the canonical JSON of a run's figures, which the plan approval's content hash covers. */
export const planResultsHash = (results: unknown): string => sha256Hex(canonicalJson(results));
