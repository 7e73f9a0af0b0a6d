/**
 * The engine's identity, stamped on every result so an archived analysis can be reproduced.
 * The generator named here is seedrandom's xor4096 (R. P. Brent's 4096-bit xorgens); see rng.ts.
 */
export const GENERATOR = 'seedrandom xor4096';
export const ENGINE_VERSION = 'parallax-stats 1.0.0 (xor4096)';

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
