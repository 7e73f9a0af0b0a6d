import { decimalsOption, integerOption, numberOption, OptionError, seedOption } from './options';
import type { PrecisionOptions } from './precision-types';

export interface ResolvedMaterial {
  name: string;
  claimRepeatability: number;
  claimWithinLab: number;
  claimAs: 'sd' | 'cv';
  assignedValue: number | null;
  assignedUncertainty: number;
  assignedSource: string;
}

export interface ResolvedPrecisionOptions {
  materials: ResolvedMaterial[];
  days: number;
  replicates: number;
  alpha: number;
  outlierFactor: number;
  decimals: number | null;
  seed: string;
}

/** The planned design of CLSI EP15-A3 practice (DOMAIN.md): 5 days × 5 replicates. */
export const PLANNED_DAYS = 5;
export const PLANNED_REPLICATES = 5;
export const DEFAULT_ALPHA = 0.05;
/** |x − day mean| > 5.5·s_r flags a replicate (common practice, DOMAIN.md "Precision"). */
export const DEFAULT_OUTLIER_FACTOR = 5.5;

/**
 * Checks the settings of a precision verification. Material names are compared trimmed, as given (case
 * counts); a name may appear once. Claims are positive SDs (in the unit) or CVs (in %), as `claimAs` says.
 * @throws OptionError naming the option (and the material) that is wrong
 */
export function resolvePrecisionOptions(o: PrecisionOptions): ResolvedPrecisionOptions {
  if (!o || typeof o !== 'object') throw new OptionError('materials', 'must list at least one material');
  if (!Array.isArray(o.materials) || o.materials.length === 0) throw new OptionError('materials', 'must list at least one material');
  const seen = new Set<string>();
  const materials = o.materials.map((m, i): ResolvedMaterial => {
    if (!m || typeof m !== 'object' || typeof m.name !== 'string' || m.name.trim() === '') {
      throw new OptionError('materials', `entry ${i + 1} needs a name`);
    }
    const name = m.name.trim();
    if (seen.has(name)) throw new OptionError('materials', `names "${name}" twice; each material is listed once`);
    seen.add(name);
    const positive = (field: string, value: unknown): number => {
      if (typeof value !== 'number' || !Number.isFinite(value) || !(value > 0)) {
        throw new OptionError('materials', `"${name}": ${field} must be a positive number`);
      }
      return value;
    };
    if (m.claimAs !== 'sd' && m.claimAs !== 'cv') throw new OptionError('materials', `"${name}": claimAs must be 'sd' or 'cv'`);
    const assignedValue = m.assignedValue ?? null;
    if (assignedValue !== null && (typeof assignedValue !== 'number' || !Number.isFinite(assignedValue))) {
      throw new OptionError('materials', `"${name}": assignedValue must be a number or empty`);
    }
    const assignedUncertainty = m.assignedUncertainty ?? 0;
    if (typeof assignedUncertainty !== 'number' || !Number.isFinite(assignedUncertainty) || assignedUncertainty < 0) {
      throw new OptionError('materials', `"${name}": assignedUncertainty must be a number ≥ 0 or empty`);
    }
    if (m.assignedSource !== undefined && m.assignedSource !== null && typeof m.assignedSource !== 'string') {
      throw new OptionError('materials', `"${name}": assignedSource must be text`);
    }
    return {
      name,
      claimRepeatability: positive('claimRepeatability', m.claimRepeatability),
      claimWithinLab: positive('claimWithinLab', m.claimWithinLab),
      claimAs: m.claimAs,
      assignedValue,
      assignedUncertainty,
      assignedSource: m.assignedSource ?? '',
    };
  });
  return {
    materials,
    days: integerOption('days', o.days, PLANNED_DAYS, 2, 100),
    replicates: integerOption('replicates', o.replicates, PLANNED_REPLICATES, 2, 100),
    alpha: numberOption('alpha', o.alpha, DEFAULT_ALPHA, (v) => v > 0 && v < 0.5, 'between 0 and 0.5 (exclusive)'),
    outlierFactor: numberOption('outlierFactor', o.outlierFactor, DEFAULT_OUTLIER_FACTOR, (v) => v > 0 && v <= 100, 'a number above 0 and at most 100'),
    decimals: decimalsOption(o.decimals),
    seed: seedOption(o.seed),
  };
}
