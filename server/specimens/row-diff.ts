import type { CleanRow } from './row-validation';

export interface CellChange { row: number; field: string; from: unknown; to: unknown }

const FIELDS = ['label', 'comparativeText', 'candidateText', 'valueText', 'sex', 'ageBand', 'excluded', 'exclusionReason', 'note'] as const;
const NAMES: Record<string, string> = { comparativeText: 'comparative', candidateText: 'candidate', valueText: 'value' };
const LIMIT = 2000;

/** Cell-by-cell changes between the stored rows and the new ones (row numbers are 1-based). */
export function diffRows(before: CleanRow[], after: CleanRow[]) {
  const changes: CellChange[] = [];
  let more = 0;
  const common = Math.min(before.length, after.length);
  for (let i = 0; i < common; i++) {
    for (const f of FIELDS) {
      if ((before[i][f] ?? null) !== (after[i][f] ?? null)) {
        if (changes.length < LIMIT) changes.push({ row: i + 1, field: NAMES[f] ?? f, from: before[i][f] ?? null, to: after[i][f] ?? null });
        else more++;
      }
    }
    // A kind's own fields (a precision row's material, day, replicate).
    const extras = new Set([...Object.keys(before[i].extra ?? {}), ...Object.keys(after[i].extra ?? {})]);
    for (const f of extras) {
      const from = before[i].extra?.[f] ?? null;
      const to = after[i].extra?.[f] ?? null;
      if (from !== to) {
        if (changes.length < LIMIT) changes.push({ row: i + 1, field: f, from, to });
        else more++;
      }
    }
  }
  return {
    changes,
    moreChanges: more,
    added: after.slice(before.length).map((r, k) => ({ row: before.length + k + 1, ...compact(r) })).slice(0, LIMIT),
    removed: before.slice(after.length).map((r, k) => ({ row: after.length + k + 1, ...compact(r) })).slice(0, LIMIT),
  };
}

const compact = (r: CleanRow) =>
  Object.fromEntries(Object.entries({ ...(r.extra ?? {}), label: r.extra && !r.label ? undefined : r.label, comparative: r.comparativeText, candidate: r.candidateText, value: r.valueText, sex: r.sex, ageBand: r.ageBand, excluded: r.excluded || undefined, exclusionReason: r.exclusionReason ?? undefined, note: r.note || undefined }).filter(([, v]) => v !== null && v !== undefined));
