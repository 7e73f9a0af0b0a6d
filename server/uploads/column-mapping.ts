const PATTERNS: Record<string, RegExp> = {
  label: /^(specimen|sample|label|id|specimen.?id|sample.?id)$/i,
  comparative: /(comparative|current|reference|old|^x$)/i,
  candidate: /(candidate|new|test|^y$)/i,
  value: /^(value|result|concentration)$/i,
  sex: /^(sex|gender)$/i,
  ageBand: /^(age.?band|age.?group|age)$/i,
  note: /^(note|notes|comment|comments)$/i,
};

/** Guesses which column holds which field from the header names; the user confirms or changes it. */
export function suggestMapping(kind: string, columns: string[], rows: string[][]): Record<string, string> {
  const fields = kind === 'method-comparison' ? ['label', 'comparative', 'candidate', 'note'] : ['label', 'value', 'sex', 'ageBand', 'note'];
  const mapping: Record<string, string> = {};
  const used = new Set<string>();
  for (const f of fields) {
    const hit = columns.find((c) => !used.has(c) && PATTERNS[f].test(c.trim()));
    if (hit) { mapping[f] = hit; used.add(hit); }
  }
  const numeric = columns.filter((c, i) => !used.has(c) && rows.slice(0, 20).some((r) => /^[+-]?\d+([.,]\d+)?$/.test(r[i] ?? '')));
  const needed = kind === 'method-comparison' ? ['comparative', 'candidate'] : ['value'];
  for (const f of needed) if (!mapping[f] && numeric.length) mapping[f] = numeric.shift()!;
  return mapping;
}
