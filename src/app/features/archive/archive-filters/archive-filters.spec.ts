import { TestBed } from '@angular/core/testing';
import type { ArchiveFilter } from '../archive-query';
import { httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { ArchiveFilters } from './archive-filters';

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function setUp(filter: ArchiveFilter) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations] });
  const fixture = TestBed.createComponent(ArchiveFilters);
  fixture.componentRef.setInput('filter', filter);
  const emitted: ArchiveFilter[] = [];
  fixture.componentInstance.changed.subscribe((f) => emitted.push(f));
  httpController().expectOne('/api/v1/analytes').flush([{ id: 3, name: 'Glucose', unit: 'mmol/L' }]);
  httpController().expectOne('/api/v1/instruments').flush([{ id: 5, name: 'Chemistry line 2' }]);
  httpController().expectOne('/api/v1/people').flush([{ id: 2, name: 'Dr. Imani Okafor' }]);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const input = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLInputElement;
  const type = async (id: string, value: string) => {
    input(id).value = value;
    input(id).dispatchEvent(new Event('input'));
    await pause(400);
    await fixture.whenStable();
  };
  return { fixture, el, input, type, emitted };
}

describe('ArchiveFilters', () => {
  afterEach(() => httpController().verify());

  it('shows the search in force from the address', async () => {
    const { el, input } = await setUp({ q: 'lot 7', analyteId: 3, signedFrom: '2026-01-01', page: 2 });
    expect(input('archive-q').value).toBe('lot 7');
    expect(input('archive-signed-from').value).toBe('2026-01-01');
    expect(el.querySelector('[data-testid="archive-analyte"]')?.textContent).toContain('Glucose (mmol/L)');
  });

  it('hands every field of an edit on after a short pause, ids as numbers and blanks left out', async () => {
    const { type, emitted } = await setUp({ analyteId: 3 });
    await type('archive-q', '  glucose ');
    expect(emitted).toEqual([{ q: 'glucose', analyteId: 3 }]);
  });

  it('does not search with a date range that runs backwards, and says so', async () => {
    const { el, type, emitted } = await setUp({ createdFrom: '2026-03-01' });
    await type('archive-created-to', '2026-02-01');
    expect(emitted).toEqual([]);
    expect(el.querySelector('.range.invalid [role="alert"]')?.textContent).toBe('The first date is after the second.');
  });

  it('clears every field at once', async () => {
    const { fixture, el, emitted } = await setUp({ q: 'x', state: 'signed' });
    (el.querySelector('[data-testid="archive-clear"]') as HTMLButtonElement).click();
    await pause(400);
    await fixture.whenStable();
    expect(emitted).toEqual([{}]);
  });
});
