import { z } from 'zod';
import { httpParams, readQuery, routerParams, withChange } from './query-params';

const Query = z.object({
  kind: z.enum(['a', 'b']).optional(),
  id: z.coerce.number().int().positive().optional(),
  q: z.string().max(5).optional(),
  page: z.coerce.number().int().min(1).default(1),
});
type Query = z.infer<typeof Query>;
const KEYS = ['kind', 'id', 'q', 'page'] as const;

describe('readQuery', () => {
  it('reads each named key with its schema, coercing numbers', () => {
    expect(readQuery<Query>(Query.shape, KEYS, { kind: 'b', id: '12', q: 'glu', page: '3' })).toEqual({ kind: 'b', id: 12, q: 'glu', page: 3 });
  });

  it('drops values the schema refuses and keys it was not told about', () => {
    expect(readQuery<Query>(Query.shape, KEYS, { kind: 'zzz', id: '-4', q: 'far too long', other: 'x' })).toEqual({});
  });

  it('leaves absent and blank keys absent instead of filling in defaults', () => {
    expect(readQuery<Query>(Query.shape, KEYS, { page: '  ', q: '' })).toEqual({});
  });
});

describe('routerParams', () => {
  it('names every key and turns empty values into null so the router removes them', () => {
    expect(routerParams<Query>({ kind: 'a', id: 0 as number, q: '' }, KEYS)).toEqual({ kind: 'a', id: '0', q: null, page: null });
  });
});

describe('httpParams', () => {
  it('leaves out empty values and writes the rest as text', () => {
    expect(httpParams({ a: 'x', b: '', c: null, d: undefined, e: 2, f: false }).toString()).toBe('a=x&e=2&f=false');
  });
});

describe('withChange', () => {
  it('keeps the other filters and goes back to the first page', () => {
    expect(withChange<Query>({ kind: 'a', page: 4 }, { q: 'x' })).toEqual({ kind: 'a', q: 'x', page: undefined });
  });
});
