import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import type { ReleaseFilter } from '../release-query';
import { ReleaseFilters } from './release-filters';

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function setUp(filter: ReleaseFilter) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations] });
  const fixture = TestBed.createComponent(ReleaseFilters);
  fixture.componentRef.setInput('filter', filter);
  const emitted: ReleaseFilter[] = [];
  fixture.componentInstance.changed.subscribe((f) => emitted.push(f));
  httpController().expectOne('/api/v1/analytes').flush([{ id: 3, name: 'Glucose', unit: 'mmol/L' }]);
  httpController().expectOne('/api/v1/instruments').flush([{ id: 5, name: 'Chemistry line 2' }]);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const input = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLInputElement;
  const settle = async () => {
    await pause(400);
    await fixture.whenStable();
  };
  const type = async (id: string, value: string) => {
    input(id).value = value;
    input(id).dispatchEvent(new Event('input'));
    await settle();
  };
  const choose = async (id: string, text: string) => {
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: `[data-testid="${id}"]` }));
    await select.open();
    await select.clickOptions({ text });
    await settle();
  };
  return { fixture, el, input, type, choose, emitted };
}

describe('ReleaseFilters', () => {
  afterEach(() => httpController().verify());

  it('shows the search in force', async () => {
    const { el, input } = await setUp({ q: 'lot 24', changeType: 'reagent-lot', analyteId: 3, signedFrom: '2026-01-01' });
    expect(input('release-q').value).toBe('lot 24');
    expect(input('release-signed-from').value).toBe('2026-01-01');
    expect(el.querySelector('[data-testid="release-filter-change-type"]')?.textContent).toContain('New reagent lot');
    expect(el.querySelector('[data-testid="release-filter-analyte"]')?.textContent).toContain('Glucose (mmol/L)');
  });

  it('turns every field into the query: words trimmed, ids as numbers, blanks left out', async () => {
    const { type, choose, emitted } = await setUp({});
    await choose('release-filter-state', 'Needs review');
    await choose('release-filter-instrument', 'Chemistry line 2');
    await type('release-q', '  glucose ');
    await type('release-signed-to', '2026-06-30');
    expect(emitted.at(-1)).toEqual({ q: 'glucose', state: 'needs-review', instrumentId: 5, signedTo: '2026-06-30' });
  });

  it('does not search with signed dates that run backwards, and says so', async () => {
    const { el, type, emitted } = await setUp({ signedFrom: '2026-03-01' });
    await type('release-signed-to', '2026-02-01');
    expect(emitted).toEqual([]);
    expect(el.querySelector('.range.invalid [role="alert"]')?.textContent).toBe('The first date is after the second.');
  });
});
