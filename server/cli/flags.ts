/**
 * Command-line flags: `--name value` pairs after KIND and FILE. Each kind declares its flags with a parser;
 * an unknown flag, a missing value or a bad value is a FlagError naming the flag.
 */
export class FlagError extends Error {}

export type FlagParser = (text: string, flag: string) => unknown;

export const integerFlag: FlagParser = (t, flag) => {
  if (!/^\d+$/.test(t)) throw new FlagError(`${flag} must be a whole number, got "${t}"`);
  return Number(t);
};
export const numberFlag: FlagParser = (t, flag) => {
  const v = Number(t);
  if (t.trim() === '' || !Number.isFinite(v)) throw new FlagError(`${flag} must be a number, got "${t}"`);
  return v;
};
export const textFlag: FlagParser = (t) => t;
export const listFlag: FlagParser = (t, flag) => t.split(',').map((part) => numberFlag(part.trim(), flag));
export const wordsFlag: FlagParser = (t) => t.split(',').map((part) => part.trim()).filter(Boolean);

/** flag spec: '--loa-multiplier' → [option name, parser] */
export type FlagSpec = Record<string, [string, FlagParser]>;

export function parseFlags(args: string[], spec: FlagSpec): Record<string, unknown> {
  const options: Record<string, unknown> = {};
  for (let i = 0; i < args.length; i += 2) {
    const flag = args[i];
    const entry = spec[flag];
    if (!entry) throw new FlagError(`unknown option ${flag} (known: ${Object.keys(spec).join(' ')})`);
    const value = args[i + 1];
    if (value === undefined || (value.startsWith('--') && !/^--?\d/.test(value))) throw new FlagError(`${flag} needs a value`);
    options[entry[0]] = entry[1](value, flag);
  }
  return options;
}

/** The flag that sets an engine option, for error messages ('loaMultiplier' → '--loa-multiplier'). */
export function flagFor(spec: FlagSpec, option: string): string {
  return Object.entries(spec).find(([, [name]]) => name === option)?.[0] ?? option;
}
