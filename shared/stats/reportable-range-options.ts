import { DEFAULT_RESAMPLES, MAX_RESAMPLES, MIN_RESAMPLES } from './bootstrap';
import { decimalsOption, integerOption, isLevel, LEVEL_RULE, numberOption, OptionError, optionalNumber, seedOption } from './options';
import { RANGE_LEVELS } from './reportable-range-types';
import { roundSignificant } from './precision';
import type { RangeBasis, RangeOptions } from './reportable-range-types';

export interface ResolvedLevel {
  name: string;
  /** x of the fit: the assigned value (given or from the pools) or, on the 'fraction' basis, the fraction. */
  x: number;
  assigned: number | null;
  fraction: number | null;
}

export interface ResolvedRangeOptions {
  levels: ResolvedLevel[];
  basis: RangeBasis;
  replicates: number;
  goalAbsolute: number | null;
  goalPercent: number | null;
  claimedLow: number | null;
  claimedHigh: number | null;
  alpha: number;
  confidenceLevel: number;
  resamples: number;
  seed: string;
  decimals: number | null;
  unit: string;
}

/** CLSI EP06 practice (DOMAIN.md "Reportable range", from memory): 5 to 11 levels, 2 or 3 replicates each. */
const PLANNED_REPLICATES = 2;

/**
 * The value a mixture of the pools carries: poolLow + fraction·(poolHigh − poolLow), to 12 significant digits so
 * 0.3 + 0.5·(36 − 0.3) is 18.15, not 18.150000000000002; null unless all three are given. The engine's x, the
 * Setup form's hint and the report's plan all take it from here.
 */
export function mixtureValue(fraction: number | null | undefined, poolLow: number | null | undefined, poolHigh: number | null | undefined): number | null {
  if (fraction === null || fraction === undefined || poolLow === null || poolLow === undefined || poolHigh === null || poolHigh === undefined) return null;
  return roundSignificant(poolLow + fraction * (poolHigh - poolLow), 12);
}

/**
 * Checks the settings of a reportable-range study. Level names are compared trimmed and without regard to case;
 * a name may appear once. A level gives an assigned value or a mixing fraction (of the high pool), not both.
 * Basis: 'assigned' when every level has an assigned value, or when the pools' values are given (a fraction f then
 * assigns poolLow + f·(poolHigh − poolLow)); 'fraction' when every level is a fraction and no pools are given.
 * @throws OptionError naming the option (and the level) that is wrong
 */
export function resolveRangeOptions(o: RangeOptions): ResolvedRangeOptions {
  if (!o || typeof o !== 'object' || !Array.isArray(o.levels) || o.levels.length === 0) {
    throw new OptionError('levels', 'must list the levels with their assigned values or mixing fractions');
  }
  if (o.levels.length > RANGE_LEVELS.most) throw new OptionError('levels', `must list at most ${RANGE_LEVELS.most} levels`);
  const poolLow = optionalNumber('poolLow', o.poolLow, () => true, 'a number');
  const poolHigh = optionalNumber('poolHigh', o.poolHigh, () => true, 'a number');
  if ((poolLow === null) !== (poolHigh === null)) throw new OptionError('poolHigh', 'and poolLow must be given both or neither');
  if (poolLow !== null && poolHigh !== null && !(poolHigh > poolLow)) throw new OptionError('poolHigh', 'must be above poolLow');
  const seen = new Set<string>();
  const given = o.levels.map((l, i) => {
    if (!l || typeof l !== 'object' || typeof l.name !== 'string' || l.name.trim() === '') throw new OptionError('levels', `entry ${i + 1} needs a name`);
    const name = l.name.trim();
    if (seen.has(name.toLowerCase())) throw new OptionError('levels', `names "${name}" twice; each level is listed once`);
    seen.add(name.toLowerCase());
    const assigned = optionalNumber('levels', l.assigned, () => true, `a number (level "${name}": assigned value)`);
    const fraction = optionalNumber('levels', l.fraction, (v) => v >= 0 && v <= 1, `from 0 to 1 (level "${name}": mixing fraction)`);
    if ((assigned === null) === (fraction === null)) throw new OptionError('levels', `"${name}" needs either an assigned value or a mixing fraction, not both`);
    return { name, assigned, fraction };
  });
  const allFractions = given.every((l) => l.fraction !== null);
  let basis: RangeBasis = 'assigned';
  if (poolLow === null && given.some((l) => l.fraction !== null)) {
    if (!allFractions) throw new OptionError('poolLow', 'and poolHigh are needed when some levels are mixing fractions and others have assigned values');
    basis = 'fraction';
  }
  const levels: ResolvedLevel[] = given.map((l) => {
    if (basis === 'fraction') return { name: l.name, x: l.fraction!, assigned: null, fraction: l.fraction };
    const assigned = l.assigned ?? mixtureValue(l.fraction, poolLow, poolHigh)!;
    return { name: l.name, x: assigned, assigned, fraction: l.fraction };
  });
  const goalAbsolute = optionalNumber('allowableNonlinearity', o.allowableNonlinearity, (v) => v > 0, 'a number above 0');
  const goalPercent = optionalNumber('allowableNonlinearityPercent', o.allowableNonlinearityPercent, (v) => v > 0 && v <= 100, 'a number above 0 and at most 100');
  if (goalAbsolute === null && goalPercent === null) {
    throw new OptionError('allowableNonlinearity', 'is not set: give the allowable nonlinearity in the unit or in % (or both) before running the analysis');
  }
  const claimedLow = optionalNumber('claimedLow', o.claimedLow, () => true, 'a number');
  const claimedHigh = optionalNumber('claimedHigh', o.claimedHigh, () => true, 'a number');
  if (claimedLow !== null && claimedHigh !== null && !(claimedHigh > claimedLow)) throw new OptionError('claimedHigh', 'must be above claimedLow');
  return {
    levels, basis,
    replicates: integerOption('replicates', o.replicates, PLANNED_REPLICATES, 1, 10),
    goalAbsolute, goalPercent, claimedLow, claimedHigh,
    alpha: numberOption('alpha', o.alpha, 0.05, (v) => v > 0 && v < 0.5, 'between 0 and 0.5 (exclusive)'),
    confidenceLevel: numberOption('confidenceLevel', o.confidenceLevel, 0.95, isLevel, LEVEL_RULE),
    resamples: integerOption('resamples', o.resamples, DEFAULT_RESAMPLES, MIN_RESAMPLES, MAX_RESAMPLES),
    seed: seedOption(o.seed),
    decimals: decimalsOption(o.decimals),
    unit: typeof o.unit === 'string' ? o.unit : '',
  };
}
