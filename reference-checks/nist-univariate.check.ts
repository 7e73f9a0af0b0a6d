import { analyzeComparison, mean, sampleSd } from '@shared/stats';
import { logRelativeError, nistUnivariate } from './support';

// Source: NIST Statistical Reference Datasets, Univariate Summary Statistics (certified with 500-digit
// arithmetic, given to 15 significant digits). Data and certified values copied from the project's
// shared reference data into reference-checks/data/nist-strd-univariate/ (provenance in README.md).
// Tolerance: the computed value agrees with the certified one to at least 14 of its 15 significant digits
// (NIST's log relative error, LRE >= 14), NumAcc3 and NumAcc4 included.
const DATASETS = ['PiDigits', 'Mavro', 'Michelso', 'NumAcc1', 'NumAcc2', 'NumAcc3', 'NumAcc4'];

describe('NIST StRD univariate: certified mean and SD', () => {
  it.each(DATASETS)('%s: mean and SD (n − 1) to the certified digits (NIST StRD)', (name) => {
    const { values, mean: certifiedMean, sd: certifiedSd } = nistUnivariate(name);
    expect(values.length).toBeGreaterThan(2);
    expect(logRelativeError(mean(values), certifiedMean)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(sampleSd(values), certifiedSd)).toBeGreaterThanOrEqual(14);
  });

  it.each(['Michelso', 'NumAcc1', 'NumAcc3'])('%s: the SD used in limits of agreement keeps the certified digits (NIST StRD)', (name) => {
    const { values, mean: certifiedMean, sd: certifiedSd } = nistUnivariate(name);
    const result = analyzeComparison(values.map((y) => ({ x: 0, y })), { resamples: 1000 });
    expect(logRelativeError(result.bias.mean.estimate!, certifiedMean)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(result.sd.estimate!, certifiedSd)).toBeGreaterThanOrEqual(14);
    expect(result.limitsOfAgreement.upper.estimate).toBeCloseTo(certifiedMean + 1.96 * certifiedSd, 6);
  });
});
