import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { intervalVerifyMeta } from '@shared/kinds/interval-verify/meta';
import type { IntervalResult } from '@shared/stats/interval-types';
import type { VerifyIntervalResult } from '@shared/stats/verify-interval';
import { stepWords, type StepWords } from '@shared/types/resolution-words';

/** An establishment's results as the API returns them: the engine's result plus the flagged rows' grid positions. */
export type EstablishResult = IntervalResult & { outlierPositions?: number[] };

/** A verification's results: the engine's count plus what the server adds (the stated interval, grid positions). */
export type VerifyResult = VerifyIntervalResult & {
  excludedCount: number;
  outsidePositions: number[];
  stated: { lower: number; upper: number; source: string };
  caution: string;
};

export function asEstablish(results: unknown): EstablishResult | null {
  const r = results as Partial<IntervalResult> | null;
  return r && r.kind === intervalEstablishMeta.resultKind ? (r as EstablishResult) : null;
}

export function asVerify(results: unknown): VerifyResult | null {
  const r = results as Partial<VerifyIntervalResult> | null;
  return r && r.kind === intervalVerifyMeta.resultKind ? (r as VerifyResult) : null;
}

/**
 * What the reporting step allows: the words beside each limit whose CI is narrower than one step, keyed by
 * its path ('upper', 'partitions.0.intervals.1.lower'), and the rule to state once above the limits (null
 * when no limit is limited, and for results stored before the engine reported its step).
 */
export function intervalStepWords(result: Pick<IntervalResult, 'resolution'>, unit: string): StepWords {
  return stepWords(result.resolution, unit);
}
