/** The most sizes one plan tries, and the smallest and largest n (the shared SamplePlan's limits). */
export const GRID_LIMITS = { points: 12, min: 5, max: 2000 } as const;

/**
 * The numbers of specimens to try, as the field holds them ("40, 60, 80"): whole numbers from 5 to 2,000, at
 * most 12, each once; commas, semicolons or spaces between them. Either the numbers or what is wrong, in words
 * that name the entry.
 */
export function parseGrid(text: string): { values: number[]; error: null } | { values: null; error: string } {
  const parts = text.split(/[,;\s]+/).filter((p) => p !== '');
  const fail = (error: string) => ({ values: null, error });
  if (parts.length === 0) return fail('List at least one number of specimens, e.g. 40, 60, 80');
  const values: number[] = [];
  for (const part of parts) {
    if (!/^\d+$/.test(part)) return fail(`“${part}” is not a whole number; write the numbers separated by commas, e.g. 40, 60, 80`);
    const n = Number(part);
    if (n < GRID_LIMITS.min) return fail(`${n} is too few: each n must be at least ${GRID_LIMITS.min}`);
    if (n > GRID_LIMITS.max) return fail(`${n} is too many: each n must be at most 2,000`);
    if (values.includes(n)) return fail(`${n} is listed twice`);
    values.push(n);
  }
  if (values.length > GRID_LIMITS.points) return fail(`List at most ${GRID_LIMITS.points} numbers of specimens (${values.length} given)`);
  return { values, error: null };
}

/** The grid as the field shows it: "40, 60, 80". */
export const gridText = (values: readonly number[]): string => values.join(', ');
