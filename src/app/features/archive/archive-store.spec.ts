import { TestBed } from '@angular/core/testing';
import type { ArchiveItem } from '@shared/schemas';
import { apiError, httpController, provideTestHttp } from '../../../testing/http';
import { ArchiveStore } from './archive-store';

const item = (id: number, title: string): ArchiveItem => ({
  id, kind: 'method-comparison', title, analyte: 'Glucose', instruments: 'A → B', state: 'signed', verdict: 'within',
  signerName: 'Dr Vale', meaning: 'accepted', signedAt: '2026-03-01T10:00:00Z', createdAt: '2026-02-01T10:00:00Z',
  superseded: false, supersedesId: null, n: 40,
});

function setUp() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), ArchiveStore] });
  return TestBed.inject(ArchiveStore);
}

describe('ArchiveStore', () => {
  afterEach(() => httpController().verify());

  it('asks the archive with the filters as query parameters and holds the page it gets', () => {
    const store = setUp();
    store.search({ kind: 'method-comparison', analyteId: 3, verdict: 'exceeds', q: 'glucose lot 7', signedFrom: '2026-01-01', page: 2, pageSize: 25 });
    expect(store.loading()).toBe(true);
    const req = httpController().expectOne((r) => r.url === '/api/v1/archive');
    expect(req.request.method).toBe('GET');
    expect(req.request.urlWithParams).toBe(
      '/api/v1/archive?kind=method-comparison&analyteId=3&verdict=exceeds&q=glucose%20lot%207&signedFrom=2026-01-01&page=2&pageSize=25',
    );
    req.flush({ items: [item(4, 'Glucose lot 7')], total: 31 });
    expect(store.items().map((i) => i.title)).toEqual(['Glucose lot 7']);
    expect(store.total()).toBe(31);
    expect(store.loading()).toBe(false);
  });

  it('drops the answer to an older search when a newer one was asked', () => {
    const store = setUp();
    store.search({ q: 'old' });
    store.search({ q: 'new' });
    const [older, newer] = httpController().match((r) => r.url === '/api/v1/archive');
    expect(older.cancelled).toBe(true);
    newer.flush({ items: [item(2, 'New')], total: 1 });
    expect(store.items().map((i) => i.id)).toEqual([2]);
  });

  it('shows the server’s words when the search is refused and keeps no stale rows', () => {
    const store = setUp();
    store.search({});
    httpController().expectOne((r) => r.url === '/api/v1/archive').flush({ items: [item(1, 'A')], total: 1 });
    store.search({ signedFrom: '2026-01-01' });
    httpController()
      .expectOne((r) => r.url === '/api/v1/archive')
      .flush(apiError('The search is not valid', [{ path: 'signedFrom', message: 'Use a date like 2026-11-30' }]), { status: 400, statusText: 'Bad Request' });
    expect(store.error()).toBe('The search is not valid');
    expect(store.items()).toEqual([]);
  });
});
