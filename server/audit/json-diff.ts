/** Every leaf where two JSON values differ, as { path, stored, recomputed }; and how many leaves were compared. */
export function diffJson(stored: unknown, recomputed: unknown, path = ''): { differences: { path: string; stored: unknown; recomputed: unknown }[]; leaves: number } {
  const out: { path: string; stored: unknown; recomputed: unknown }[] = [];
  let leaves = 0;
  const walk = (a: unknown, b: unknown, p: string) => {
    const objA = typeof a === 'object' && a !== null;
    const objB = typeof b === 'object' && b !== null;
    if (objA && objB && Array.isArray(a) === Array.isArray(b)) {
      const keys = new Set([...Object.keys(a as object), ...Object.keys(b as object)]);
      for (const k of keys) walk((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], Array.isArray(a) ? `${p}[${k}]` : p ? `${p}.${k}` : k);
      return;
    }
    leaves++;
    if (!Object.is(a, b)) out.push({ path: p || '(root)', stored: a ?? null, recomputed: b ?? null });
  };
  walk(stored, recomputed, path);
  return { differences: out, leaves };
}
