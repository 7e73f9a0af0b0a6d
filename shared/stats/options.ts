/**
 * Validation of analysis options. A bad option throws OptionError (a RangeError) naming the option,
 * so the server can answer 400 and the command line can name its flag.
 */
export class OptionError extends RangeError {
  constructor(readonly option: string, message: string) {
    super(`option ${option} ${message}`);
  }
}

export function integerOption(option: string, value: unknown, fallback: number, min: number, max: number): number {
  if (value === undefined || value === null) return fallback;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new OptionError(option, `must be an integer from ${min} to ${max}`);
  }
  return value;
}

export function numberOption(option: string, value: unknown, fallback: number, check: (v: number) => boolean, rule: string): number {
  if (value === undefined || value === null) return fallback;
  if (typeof value !== 'number' || !Number.isFinite(value) || !check(value)) throw new OptionError(option, `must be ${rule}`);
  return value;
}

export function optionalNumber(option: string, value: unknown, check: (v: number) => boolean, rule: string): number | null {
  return value === undefined || value === null ? null : numberOption(option, value, 0, check, rule);
}

export function choiceOption<T extends string>(option: string, value: unknown, fallback: T, choices: readonly T[]): T {
  if (value === undefined || value === null) return fallback;
  if (typeof value !== 'string' || !(choices as readonly string[]).includes(value)) {
    throw new OptionError(option, `must be one of ${choices.join(', ')}`);
  }
  return value as T;
}

export function seedOption(value: unknown): string {
  if (value === undefined || value === null) return DEFAULT_SEED;
  if (typeof value !== 'string' || value.length === 0 || value.length > 200) throw new OptionError('seed', 'must be a non-empty string of at most 200 characters');
  return value;
}

export function numberListOption(option: string, value: unknown, check: (v: number) => boolean, rule: string): number[] {
  if (value === undefined || value === null) return [];
  if (!Array.isArray(value) || !value.every((v) => typeof v === 'number' && Number.isFinite(v) && check(v))) {
    throw new OptionError(option, `must be a list of numbers, each ${rule}`);
  }
  return [...value];
}

/** The seed used when none is given: results stay reproducible, and the seed is printed with them. */
export const DEFAULT_SEED = 'parallax';

export const isLevel = (v: number): boolean => v > 0 && v < 1;
export const LEVEL_RULE = 'between 0 and 1 (exclusive)';

/** The analyte's reporting decimals (−6 to 12: a step from 1,000,000 down to 1e-12), or null to detect the step from the data. */
export function decimalsOption(value: unknown): number | null {
  return value === undefined || value === null ? null : integerOption('decimals', value, 0, -6, 12);
}
