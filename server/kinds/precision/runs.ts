import seedrandom from 'seedrandom';

const gaussian = (rng: () => number) => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());

/**
 * Invented days × replicates: each day's shift drawn with SD `betweenDay`, each result around it with SD
 * `repeatability` (one run a day), to `decimals`. Deterministic.
 */
export function precisionRuns(seed: string, material: string, days: string[], replicates: number, mean: number, repeatability: number, betweenDay: number, decimals: number) {
  const rng = seedrandom(seed);
  return days.flatMap((day) => {
    const shift = betweenDay * gaussian(rng);
    return Array.from({ length: replicates }, (_, k) => ({
      material, day, replicate: k + 1, value: (mean + shift + repeatability * gaussian(rng)).toFixed(decimals),
    }));
  });
}
