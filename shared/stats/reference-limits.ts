import { jStat } from 'jstat';
import { biweightLocation, biweightScale } from './biweight';
import { inverseScaledBoxCox, scaledBoxCox, type BoxCoxFit } from './box-cox';
import { momentsFromCounts, quantileFromCounts } from './counts-stats';

/**
 * Reference limits by three methods, each as a function of a sample given as counts over the sorted
 * values (all ones for the data itself, bootstrap counts for a resample):
 * - nonparametric: the definition-6 percentile at rank p(n + 1) with interpolation (quantile.ts;
 *   CLSI EP28-A3c practice); not estimable when the rank falls outside 1..n;
 * - parametric: x̄ + z_p·s of the Box–Cox-transformed values (box-cox.ts), back-transformed; without a
 *   transform (values not all positive) the plain Gaussian limit x̄ + z_p·s of the values themselves, which
 *   may be at or below 0;
 * - robust: T + t(n − 1, p)·S·sqrt(1 + 1/n) with T, S the biweight location and scale (biweight.ts), after
 *   P. S. Horn, A. J. Pesce and B. E. Copeland (1998), Clin. Chem. 44(3), 622–631 (the factor sqrt(1 + 1/n)
 *   makes it a prediction limit for one new value; our statement of the method, from memory).
 */
export type ReferenceMethod = 'nonparametric' | 'robust' | 'parametric';

/** p: fractions in (0, 1); fit: the Box–Cox transform (parametric only; null = untransformed). */
export interface LimitContext {
  method: ReferenceMethod;
  fit: BoxCoxFit | null;
  /** The sorted values, transformed when the method is parametric. */
  sorted: Float64Array;
  scratch: Float64Array;
  moments: Float64Array;
}

export function limitContext(method: ReferenceMethod, sortedValues: Float64Array, fit: BoxCoxFit | null): LimitContext {
  const transform = method === 'parametric' ? fit : null;
  const sorted = transform ? sortedValues.map((v) => scaledBoxCox(v, transform)) : sortedValues;
  return { method, fit: transform, sorted, scratch: new Float64Array(sorted.length), moments: new Float64Array(2) };
}

export function limitFromCounts(ctx: LimitContext, counts: Int32Array, p: number): number {
  const n = ctx.sorted.length;
  switch (ctx.method) {
    case 'nonparametric':
      return quantileFromCounts(ctx.sorted, counts, n, p);
    case 'parametric': {
      momentsFromCounts(ctx.sorted, counts, n, ctx.sorted[n >> 1], ctx.moments);
      const limit = ctx.moments[0] + jStat.normal.inv(p, 0, 1) * ctx.moments[1];
      return ctx.fit ? inverseScaledBoxCox(limit, ctx.fit) : limit;
    }
    case 'robust': {
      let w = 0;
      for (let k = 0; k < n; k++) for (let c = counts[k]; c > 0; c--) ctx.scratch[w++] = ctx.sorted[k];
      const t = biweightLocation(ctx.scratch);
      const s = biweightScale(ctx.scratch, t);
      return t + jStat.studentt.inv(p, n - 1) * s * Math.sqrt(1 + 1 / n);
    }
  }
}
