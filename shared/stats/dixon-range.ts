/**
 * Dixon's gap rule as used for reference values (A. H. Reed, R. J. Henry and W. B. Mason (1971), Clin. Chem.
 * 17(4), 275–284; from memory): flag an extreme value when D/R > 1/3, D its gap to the next value and R the
 * range. The rule is applied to the lowest and the highest value, and again to the new extreme of the
 * remaining values after each flag (so two outliers side by side are not hidden), while at least 3 remain.
 * Flags only. @returns indexes (into values) of the flagged values
 */
export function dixonRange(values: ArrayLike<number>): number[] {
  const order = Array.from({ length: values.length }, (_, i) => i).sort((a, b) => values[a] - values[b]);
  let lo = 0;
  let hi = order.length - 1;
  const flagged: number[] = [];
  let changed = true;
  while (changed && hi - lo >= 2) {
    changed = false;
    const range = values[order[hi]] - values[order[lo]];
    if (range === 0) break;
    if (exceedsThird(values[order[lo + 1]] - values[order[lo]], range)) { flagged.push(order[lo++]); changed = true; continue; }
    if (exceedsThird(values[order[hi]] - values[order[hi - 1]], range)) { flagged.push(order[hi--]); changed = true; }
  }
  return flagged.sort((a, b) => a - b);
}

/** D/R > 1/3, with a relative margin of 1e-9 so that binary rounding of decimal data (0.1/0.3) cannot decide it. */
function exceedsThird(gap: number, range: number): boolean {
  return 3 * gap > range * (1 + 1e-9);
}
