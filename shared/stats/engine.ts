/**
 * The engine's identity, stamped on every result so an archived analysis can be reproduced.
 * The generator named here is seedrandom's xor128 (Marsaglia's xorshift128); see rng.ts.
 * 1.3.0: Passing–Bablok by slope selection (slope-selection.ts), no longer refused above 3,000 pairs; every
 * result 1.2.0 gave is given again bit for bit (the same draws, the same slopes).
 * 1.3.1: warnings word one of a thing in the singular ("1 possible outlier (row 7)", not "outlier(s)");
 * every number 1.3.0 gave is given again bit for bit.
 * 1.4.0: the regression adds the fitted line's pointwise CI band (regression.band), estimated from the same
 * resamples; every number 1.3.1 gave is given again bit for bit.
 */
export const GENERATOR = 'seedrandom xor128';
export const ENGINE_VERSION = 'parallax-stats 1.4.0 (xor128)';

export interface EngineInfo {
  version: string;
  seed: string;
  resamples: number;
  generator: string;
  regressionResamples?: number;
}

export function engineInfo(seed: string, resamples: number, regressionResamples?: number): EngineInfo {
  const info: EngineInfo = { version: ENGINE_VERSION, seed, resamples, generator: GENERATOR };
  if (regressionResamples !== undefined) info.regressionResamples = regressionResamples;
  return info;
}
