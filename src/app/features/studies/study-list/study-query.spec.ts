import { paramsFromQuery, queryFromParams, withFilter } from './study-query';

describe('the studies list query in the address', () => {
  it('reads typed values with the API schema', () => {
    expect(queryFromParams({ kind: 'method-comparison', analyteId: '3', page: '2', q: 'glucose', sort: 'title', order: 'asc' })).toEqual({
      kind: 'method-comparison', analyteId: 3, page: 2, q: 'glucose', sort: 'title', order: 'asc',
    });
  });

  it('drops values the schema refuses instead of failing', () => {
    expect(queryFromParams({ kind: 'nonsense', analyteId: 'x', page: '0', from: '2026-13', to: '2026-05-01' })).toEqual({ to: '2026-05-01' });
  });

  it('writes empty values as null so they leave the address', () => {
    expect(paramsFromQuery({ q: '', state: 'draft', page: 3 })).toMatchObject({ q: null, state: 'draft', page: '3', kind: null });
  });

  it('goes back to the first page when a filter changes', () => {
    expect(withFilter({ state: 'draft', page: 4 }, { analyteId: 2 })).toEqual({ state: 'draft', analyteId: 2, page: undefined });
  });
});
