import { archiveExportUrl, archiveFilterFrom } from './archive-query';

describe('archiveFilterFrom', () => {
  it('reads the archive search from the address with the API schema', () => {
    expect(
      archiveFilterFrom({
        kind: 'method-comparison', analyteId: '3', verdict: 'exceeds', signedFrom: '2026-01-01', signedTo: 'soon', q: 'glucose',
        sort: 'signedAt', order: 'asc', page: '2', pageSize: '50', signerId: '9',
      }),
    ).toEqual({ kind: 'method-comparison', analyteId: 3, verdict: 'exceeds', signerId: 9, signedFrom: '2026-01-01', q: 'glucose', sort: 'signedAt', order: 'asc', page: 2, pageSize: 50 });
  });

  it('refuses an unknown verdict, state or sort column', () => {
    expect(archiveFilterFrom({ verdict: 'green', state: 'archived', sort: 'colour' })).toEqual({});
  });
});

describe('archiveExportUrl', () => {
  it('keeps the filters and the order but not the page', () => {
    expect(archiveExportUrl({ state: 'signed', q: 'a b&c', sort: 'title', order: 'asc', page: 3, pageSize: 10 })).toBe(
      '/api/v1/archive/export.xlsx?state=signed&q=a%20b%26c&sort=title&order=asc',
    );
  });

  it('asks for the whole archive when nothing is filtered', () => {
    expect(archiveExportUrl({ page: 2 })).toBe('/api/v1/archive/export.xlsx');
  });
});
