/**
 * The engine's identity, stamped on every result so an archived analysis can be reproduced.
 * The generator named here is seedrandom's xor128 (Marsaglia's xorshift128); see rng.ts.
 */
export const GENERATOR = 'seedrandom xor128';
export const ENGINE_VERSION = 'parallax-stats 1.2.0 (xor128)';

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
