import { type Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import type { ComparisonFindingsResult, Units } from '../app/features/studies/findings/comparison/comparison-result';
import type { EstablishResult } from '../app/features/studies/intervals/findings/interval-result';

/** How sodium findings write their numbers: mmol/L, one decimal more than the analyte's 0. */
export const SODIUM_UNITS: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 1, differenceDecimals: 1, percent: false };

/** An async render of a findings component with these result and units inputs. */
export async function renderFindings<T>(component: Type<T>, result: unknown, units: Units = SODIUM_UNITS): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(component);
  fixture.componentRef.setInput('result', result);
  fixture.componentRef.setInput('units', units);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

/**
 * Findings of whole-mmol/L sodium for the client's tests, written out by hand in the shape the engine
 * returns (the browser runs no engine): CIs that collapse to one value, named in resolution.limitedEstimates.
 */
export function sodiumComparison(): ComparisonFindingsResult {
  const level = (at: number): ComparisonFindingsResult['decisionLevels'][number] => ({
    level: at, bias: { estimate: 1, ci: [1, 1] }, biasPercent: 100 / at, allowable: 2, verdict: 'within', judgedOn: [0.5, 1.5],
  });
  return {
    kind: methodComparisonMeta.resultKind, n: 60, nTotal: 60, excluded: { count: 0, rows: [] }, differenceType: 'absolute',
    bias: { mean: { estimate: 0.83, ci: [0.55, 1.08], pValue: 0.0005, se: 0.13 }, median: { estimate: 1, ci: [1, 1], pValue: 0.0005, se: 0 } },
    sd: { estimate: 1.04, ci: [0.8, 1.25] },
    limitsOfAgreement: { multiplier: 1.96, lower: { estimate: -1.21, ci: [-1.78, -0.6] }, upper: { estimate: 2.88, ci: [2.44, 3.27] } },
    regression: { method: 'passing-bablok', demingRatio: null, slope: { estimate: 1, ci: [1, 1] }, intercept: { estimate: 1, ci: [1, 1] }, linearityP: 0.6, ciMethod: 'rank', correlation: 0.98 },
    decisionLevels: [level(130), level(150)],
    signTest: { positive: 38, negative: 12, zeros: 10, pValue: 0.0003 },
    wilcoxon: { statistic: 1100, n: 50, method: 'normal', pValue: 0.0001 },
    biasTests: { median: { observed: 1, nullValue: 0, pValue: 0.0005, upperTail: 0.0005, lowerTail: 1 }, mean: null },
    outliers: [], outlierIndexes: [], outlierTest: { method: 'generalized ESD (Rosner 1983)', alpha: 0.05, maxOutliers: 3, steps: [] },
    plots: { medianBias: null, meanBias: null, medianNull: null },
    sensitivity: null,
    settings: { level: 0.95, demingRatioConvention: 'λ = σ²(x error) / σ²(y error)' } as ComparisonFindingsResult['settings'],
    resolution: {
      increment: 1, source: 'analyte', differenceIncrement: 1, slopeIncrement: 1 / 33,
      limitedEstimates: ['bias.median', 'regression.slope', 'regression.intercept', 'decisionLevels.0', 'decisionLevels.1'],
    },
    warnings: [], caution: 'Decision support only.',
    engine: { version: '1.2.0', seed: 'vh-sodium', resamples: 2000, generator: 'xor128', regressionResamples: 1000 },
  };
}

const limit = (percentile: number, estimate: number, ci: [number, number]) => ({
  percentile, estimate, ci, rankCi: [ci[0] - 1, ci[1] + 1] as [number, number], ranks: null, distribution: null,
});

/** A sodium interval partitioned by sex: the overall upper limit and the women's lower limit have CIs of one value. */
export function sodiumInterval(): EstablishResult {
  return {
    kind: intervalEstablishMeta.resultKind, n: 130, nTotal: 130, excludedCount: 0, method: 'nonparametric', percentiles: [2.5, 97.5],
    lower: limit(2.5, 138, [138, 139]), upper: limit(97.5, 142, [142, 142]), boxCoxLambda: null,
    outliers: [], outlierIndexes: [], outlierScreen: { tukey: { lowerFence: 135, upperFence: 148, rows: [] }, dixon: { rows: [] } },
    partition: null,
    partitions: [{
      field: 'sex', z: 9.1, zCritical: 3, sdRatio: 1.1, recommended: true, pairs: [], noSpread: [],
      groups: [{ group: 'F', n: 65, mean: 140, sd: 0.8, lower: 138, upper: 142 }, { group: 'M', n: 65, mean: 143, sd: 0.8, lower: 142, upper: 145 }],
      intervals: [
        { group: 'F', n: 65, lower: limit(2.5, 138, [138, 138]), upper: limit(97.5, 142, [141.35, 142]), warnings: [] },
        { group: 'M', n: 65, lower: limit(2.5, 142, [142, 143]), upper: limit(97.5, 145, [144, 145]), warnings: [] },
      ],
    }],
    settings: { level: 0.9, resamples: 1000, seed: 'vh-ri-sodium' } as EstablishResult['settings'],
    resolution: { increment: 1, source: 'data', limitedEstimates: ['upper', 'partitions.0.intervals.0.lower'] },
    warnings: [], caution: 'Decision support only.',
    engine: { version: '1.2.0', seed: 'vh-ri-sodium', resamples: 1000, generator: 'xor128' },
  };
}

/** The same findings from fine-grained data: nothing is narrower than its step, no verdict is widened. */
export function fineGrained<T extends { resolution: { limitedEstimates: string[] } }>(result: T): T {
  const copy = JSON.parse(JSON.stringify(result)) as T & { decisionLevels?: { judgedOn: unknown }[] };
  copy.resolution.limitedEstimates = [];
  copy.decisionLevels?.forEach((d) => (d.judgedOn = null));
  return copy;
}

/** The same findings as engine 1.1.0 stored them: no resolution and no judgedOn. */
export function storedBeforeResolution<T extends object>(result: T): T {
  const copy = JSON.parse(JSON.stringify(result)) as T & { resolution?: unknown; decisionLevels?: { judgedOn?: unknown }[] };
  delete copy.resolution;
  copy.decisionLevels?.forEach((d) => delete d.judgedOn);
  return copy;
}
