import { HttpParams } from '@angular/common/http';
import type { ZodType } from 'zod';

/** Raw values as the address bar holds them. */
export type RawParams = Record<string, string | undefined>;
type Value = string | number | boolean | null | undefined;

/**
 * Reads the named keys of a query with the API's own field schemas. A value the schema refuses is
 * dropped (as if absent), so a hand-edited address never breaks a page; absent keys stay absent
 * (the schema's defaults are the server's business).
 */
export function readQuery<Q>(shape: Record<string, ZodType>, keys: readonly (keyof Q & string)[], params: RawParams): Partial<Q> {
  const query: Record<string, unknown> = {};
  for (const key of keys) {
    const raw = params[key]?.trim();
    if (!raw) continue;
    const parsed = shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) query[key] = parsed.data;
  }
  return query as Partial<Q>;
}

const isEmpty = (value: Value): boolean => value === undefined || value === null || value === '';

/** A query as router query params: every key named, empty ones as null so the router removes them. */
export function routerParams<Q>(query: Partial<Q>, keys: readonly (keyof Q & string)[]): Record<string, string | null> {
  const out: Record<string, string | null> = {};
  for (const key of keys) {
    const value = query[key] as Value;
    out[key] = isEmpty(value) ? null : String(value);
  }
  return out;
}

/** A query as HTTP params for the API: empty values left out. */
export function httpParams(query: object): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query) as [string, Value][]) {
    if (!isEmpty(value)) params = params.set(key, String(value));
  }
  return params;
}

/** A filter change: the other filters stay and the list goes back to its first page. */
export function withChange<Q extends { page?: number }>(query: Partial<Q>, change: Partial<Q>): Partial<Q> {
  return { ...query, ...change, page: undefined };
}
