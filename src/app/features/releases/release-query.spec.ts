import { ReleaseApi } from './release-api';
import { exportFilter, releaseFilterFrom } from './release-query';
import { TestBed } from '@angular/core/testing';
import { provideTestHttp } from '../../../testing/http';

describe('releaseFilterFrom', () => {
  it('reads the search from the address with the API’s own field rules', () => {
    expect(releaseFilterFrom({ q: ' glucose ', changeType: 'reagent-lot', analyteId: '3', signedFrom: '2026-01-01', page: '2' }))
      .toEqual({ q: 'glucose', changeType: 'reagent-lot', analyteId: 3, signedFrom: '2026-01-01', page: 2 });
  });

  it('drops values the API would refuse, so a hand-edited address never breaks the page', () => {
    expect(releaseFilterFrom({ changeType: 'new-car', state: 'maybe', analyteId: 'x', signedTo: '2026-02-30', order: 'up' })).toEqual({});
  });
});

describe('exportFilter', () => {
  it('keeps the filters and the order and leaves out the page, so the export holds every match', () => {
    TestBed.configureTestingModule({ providers: provideTestHttp() });
    const url = TestBed.inject(ReleaseApi).exportUrl(exportFilter({ state: 'released', sort: 'title', order: 'asc', page: 3, pageSize: 50 }));
    expect(url).toBe('/api/v1/releases/export.xlsx?state=released&sort=title&order=asc');
  });
});
