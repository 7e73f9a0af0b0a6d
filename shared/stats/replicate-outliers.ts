import { oneWayAnova } from './one-way-anova';

/** One day's included results, as the precision analysis groups them. */
export interface ReplicateDay {
  day: string;
  results: { value: number; replicate: number | null; position?: number }[];
}

export interface FlaggedReplicate {
  position?: number;
  day: string;
  replicate: number | null;
  value: number;
  why: string;
}

/**
 * Flags replicates far from the rest of their day: a result x of day i is flagged when
 *   |x − x̄_i(−x)| > factor·s_r(−x),
 * x̄_i(−x) the mean of the day's other results and s_r(−x) = √MS_W of the material's results without x (the
 * one-way ANOVA by day, one-way-anova.ts). The rule the design notes give, |x − x̄| > 5.5·s_r (DOMAIN.md
 * "Precision"; common practice, stated in the study plan), is applied with x left out of the day mean and of
 * s_r: with x kept in both, a single result can never reach it in a 5 × 5 design, since then
 * |x − x̄_i| ≤ (4/5)·√SS_W while s_r ≥ √(SS_W/20), a ratio of at most 4 (in general (n − 1)/n·√(N − k)).
 * Left out, x is judged against the scatter of the other results, as a planned check against a known SD is.
 * Results alone on their day, or whose removal leaves no replicate (N − k − 1 < 1), are not judged.
 * Coarse results: s_r(−x) is taken no smaller than h/√12, the SD of the rounding error of results reported in
 * steps of h (Sheppard 1898, from memory; our rule), so that one result a step away from otherwise identical
 * results (sodium 141 among 140s) is not flagged for a scatter of 0.
 * Flags only: nothing is removed; an exclusion needs a reason given by the laboratory.
 * @param days the material's days with their results; not modified
 * @param factor the multiple of s_r (5.5 by default in the settings)
 * @param step the reporting step h of the results (resolution.ts); 0 for none
 * @throws RangeError if factor is not a positive finite number or step is negative
 */
export function flagReplicates(days: ReplicateDay[], factor: number, step = 0): FlaggedReplicate[] {
  if (!(factor > 0) || !Number.isFinite(factor)) throw new RangeError('flagReplicates requires a positive finite factor');
  if (!(step >= 0) || !Number.isFinite(step)) throw new RangeError('flagReplicates requires a step ≥ 0');
  const floor = step / Math.sqrt(12);
  const groups = days.map((d) => d.results.map((r) => r.value));
  const out: FlaggedReplicate[] = [];
  days.forEach((day, i) => {
    if (day.results.length < 2) return;
    day.results.forEach((r, j) => {
      const others = groups[i].filter((_, m) => m !== j);
      const rest = groups.map((g, m) => (m === i ? others : g));
      const size = rest.reduce((a, g) => a + g.length, 0);
      if (size - rest.length < 1) return;
      const anova = oneWayAnova(rest);
      const sr = Math.max(Math.sqrt(anova.msWithin), floor);
      const centre = anova.groupMeans[i];
      const limit = factor * sr;
      const distance = Math.abs(r.value - centre);
      if (!(distance > limit)) return;
      const flagged: FlaggedReplicate = {
        day: day.day, replicate: r.replicate, value: r.value,
        why: `${r.value} lies ${say(distance)} from the mean of the other results of day ${day.day} (${say(centre, 6)}), more than ${say(factor)} × s_r = ${say(limit)} (s_r without this result${floor > 0 && sr === floor ? `, no smaller than the rounding SD h/√12` : ''}: ${say(sr)})`,
      };
      if (r.position !== undefined) flagged.position = r.position;
      out.push(flagged);
    });
  });
  return out;
}

/** A number in words: 4 (or the given) significant digits, no trailing zeros. */
function say(v: number, digits = 4): string {
  return String(Number(v.toPrecision(digits)));
}
