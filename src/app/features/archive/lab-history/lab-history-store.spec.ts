import { TestBed } from '@angular/core/testing';
import { httpController, provideTestHttp } from '../../../../testing/http';
import { LabHistoryStore } from './lab-history-store';

describe('LabHistoryStore', () => {
  afterEach(() => httpController().verify());

  it('asks the laboratory history with the filters as query parameters', () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), LabHistoryStore] });
    const store = TestBed.inject(LabHistoryStore);
    store.search({ action: 'sign-in', studyId: 4, from: '2026-01-01', page: 2, pageSize: 50 });
    const req = httpController().expectOne((r) => r.url === '/api/v1/audit');
    expect(req.request.urlWithParams).toBe('/api/v1/audit?action=sign-in&studyId=4&from=2026-01-01&page=2&pageSize=50');
    req.flush({ items: [{ id: 1, at: '2026-01-02T00:00:00Z', userName: 'A', studyId: 4, action: 'sign-in', entity: 'user', headline: 'Signed in', details: [] }], total: 61 });
    expect(store.total()).toBe(61);
    expect(store.items()[0].headline).toBe('Signed in');
  });
});
