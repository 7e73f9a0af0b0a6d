import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Role } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { releaseSummary } from '../release-fixtures.testing';
import { ReleaseListPage } from './release-list-page';

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function open(roles: Role[], url = '/releases') {
  TestBed.configureTestingModule({
    providers: [
      ...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)),
      provideRouter([{ path: 'releases', component: ReleaseListPage }, { path: 'releases/:id', children: [] }]),
    ],
  });
  await restoreSession();
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  httpController().expectOne('/api/v1/analytes').flush([{ id: 3, name: 'Glucose', unit: 'mmol/L', active: true }]);
  httpController().expectOne('/api/v1/instruments').flush([{ id: 5, name: 'Chemistry line 2', active: true }]);
  await harness.fixture.whenStable();
  const el = harness.routeNativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  return { harness, el, q };
}

const searchRequest = () => httpController().expectOne((r) => r.method === 'GET' && r.url === '/api/v1/releases');

describe('ReleaseListPage', () => {
  afterEach(() => httpController().verify());

  it('searches with the filters the address holds and shows each release in its row, its state in words', async () => {
    const { harness, el, q } = await open(['director'], '/releases?state=released&analyteId=3&page=2&sort=title&order=asc');
    const req = searchRequest();
    expect(req.request.params.keys().sort()).toEqual(['analyteId', 'order', 'page', 'sort', 'state']);
    expect(req.request.params.get('state')).toBe('released');
    expect(req.request.params.get('analyteId')).toBe('3');
    expect(req.request.params.get('page')).toBe('2');
    req.flush({
      items: [
        releaseSummary({ id: 7, state: 'released', met: 2, required: 2, signerName: 'Dr Mara Quist', signedAt: '2026-05-06T14:00:00Z', goLiveDate: '2026-05-11', verificationCode: 'REL-9X2A-77QD' }),
        releaseSummary({ id: 8, title: 'Glucose lot 25-002', changeType: 'reagent-lot', reagentLot: '', state: 'needs-review', met: 0, required: 1 }),
      ],
      total: 27,
    });
    await harness.fixture.whenStable();
    const rows = [...el.querySelectorAll('[data-testid="release-row"]')];
    expect(rows.map((r) => r.getAttribute('data-release-id'))).toEqual(['7', '8']);
    expect(rows[0].textContent).toContain('Released for patient testing');
    expect(rows[0].querySelector('mat-icon')?.textContent).toBeTruthy();
    expect(rows[0].textContent).toContain('2 of 2 met');
    expect(rows[0].textContent).toContain('Dr Mara Quist');
    expect(rows[0].textContent).toContain('2026-05-11');
    expect(rows[0].textContent).toContain('REL-9X2A-77QD');
    expect(rows[0].textContent).toContain('LOT-24117');
    expect(rows[1].textContent).toContain('New reagent lot');
    expect(rows[1].textContent).toContain('Needs review');
    expect(rows[1].textContent).toContain('Not signed');
    expect(q('release-open-7')?.getAttribute('href')).toBe('/releases/7');
    expect(q('release-count')?.textContent).toBe('27 releases match');
  });

  it('puts a typed search in the address and goes back to the first page, keeping the sort', async () => {
    const { harness, q } = await open(['technologist'], '/releases?page=3&sort=title&order=asc');
    searchRequest().flush({ items: [], total: 0 });
    const input = q('release-q') as HTMLInputElement;
    input.value = ' glucose ';
    input.dispatchEvent(new Event('input'));
    await pause(400);
    await harness.fixture.whenStable();
    const req = searchRequest();
    expect(req.request.params.get('q')).toBe('glucose');
    expect(req.request.params.get('sort')).toBe('title');
    expect(req.request.params.has('page')).toBe(false);
    req.flush({ items: [], total: 0 });
    await harness.fixture.whenStable();
    expect(q('release-table')?.textContent).toContain('No release matches this search.');
  });

  it('offers “New release” to technologists and directors and the export to directors and quality', async () => {
    const tech = await open(['technologist']);
    searchRequest().flush({ items: [], total: 0 });
    expect(tech.q('release-new')).not.toBeNull();
    expect(tech.q('release-export')).toBeNull();
    TestBed.resetTestingModule();
    const quality = await open(['quality']);
    searchRequest().flush({ items: [], total: 0 });
    expect(quality.q('release-new')).toBeNull();
    expect(quality.q('release-export')).not.toBeNull();
  });
});
