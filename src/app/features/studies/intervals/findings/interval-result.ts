import type { IntervalResult } from '../../../../../../shared/stats/interval-types';
import type { VerifyIntervalResult } from '../../../../../../shared/stats/verify-interval';

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
  return r && r.kind === 'interval' ? (r as EstablishResult) : null;
}

export function asVerify(results: unknown): VerifyResult | null {
  const r = results as Partial<VerifyIntervalResult> | null;
  return r && r.kind === 'verify-interval' ? (r as VerifyResult) : null;
}
