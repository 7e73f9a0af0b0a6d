import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HistoryRecheck } from './history-recheck';

describe('HistoryRecheck', () => {
  function setup() {
    TestBed.configureTestingModule({ imports: [HistoryRecheck], providers: [provideHttpClient(), provideHttpClientTesting()] });
    const fixture = TestBed.createComponent(HistoryRecheck);
    let checked = 0;
    fixture.componentInstance.checked.subscribe(() => checked++);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    return { fixture, el, http: TestBed.inject(HttpTestingController), checked: () => checked };
  }

  it('re-checks both chains on request and shows each one in words, a broken one named', async () => {
    const { fixture, el, http, checked } = setup();
    (el.querySelector('[data-testid="check-chains"]') as HTMLButtonElement).click();
    const req = http.expectOne('/api/v1/audit/chain-check');
    expect(req.request.method).toBe('POST');
    req.flush({
      passed: false, checkedAt: '2026-12-02T10:00:00Z',
      checks: [
        { name: 'Laboratory history', passed: false, detail: 'One problem in the laboratory\'s history: event 12 no longer matches its hash.' },
        { name: 'History without a laboratory', passed: true, detail: 'All 3 events are intact.' },
      ],
    });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="chains-outcome"]')!.textContent).toContain('Failed. One history chain is broken');
    expect(el.querySelector('[data-testid="check-Laboratory history"]')!.textContent).toContain('failed');
    expect(el.querySelector('[data-testid="check-Laboratory history"]')!.textContent).toContain('event 12 no longer matches its hash');
    expect(el.querySelector('[data-testid="check-History without a laboratory"]')!.textContent).toContain('passed');
    expect(checked()).toBe(1);
  });
});
