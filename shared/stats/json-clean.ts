/**
 * Makes a result plain JSON: non-finite numbers (NaN for "not estimable", ±Infinity) become null and typed
 * arrays become ordinary arrays, so the object the API returns is exactly what JSON.stringify prints.
 */
export function jsonClean<T>(value: T): T {
  return clean(value) as T;
}

function clean(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>, (v) => clean(v));
  if (Array.isArray(value)) return value.map(clean);
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [key, v] of Object.entries(value)) if (v !== undefined) out[key] = clean(v);
    return out;
  }
  return value;
}
