import { TestBed } from '@angular/core/testing';
import type { Role, Study } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { glucoseRows, glucoseStudy, specimensAnswer } from '../../../../../testing/engine-findings';
import { AUTOSAVE_DEBOUNCE_MS, SpecimensStore } from '../specimens-store';
import { StudyStore } from '../../study/study-store';
import { SpecimensTab } from './specimens-tab';

const wait = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** The rows' autosave, once its pause (AUTOSAVE_DEBOUNCE_MS) is over. */
async function autosave(fixture: { whenStable: () => Promise<unknown> }) {
  await wait(AUTOSAVE_DEBOUNCE_MS + 100);
  await fixture.whenStable();
  return httpController().expectOne({ method: 'PUT', url: '/api/v1/studies/12/specimens' });
}

/**
 * The Specimens tab with its real ag-grid (which renders in jsdom), for study 12 and its first five glucose rows as
 * GET /specimens answers them.
 */
async function mount(roles: Role[], study: Study = glucoseStudy({ n: 5 })) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)), StudyStore, SpecimensStore] });
  await restoreSession();
  TestBed.inject(StudyStore).adopt(study);
  const fixture = TestBed.createComponent(SpecimensTab);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer(glucoseRows(40).slice(0, 5)));
  await fixture.whenStable();
  await wait(50);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  /** The grid's rows in their order: the cells of the fields, by column id. */
  const grid = () => {
    const rows = new Map<number, Record<string, string>>();
    for (const c of Array.from(el.querySelectorAll('.ag-row [role="gridcell"]'))) {
      const index = Number(c.closest('.ag-row')!.getAttribute('row-index'));
      rows.set(index, { ...rows.get(index), [c.getAttribute('col-id')!]: c.textContent!.trim() });
    }
    return [...rows.entries()].sort(([a], [b]) => a - b).map(([, row]) => row);
  };
  const cell = (rowIndex: number, field: string) => el.querySelector(`.ag-row[row-index="${rowIndex}"] [role="gridcell"][col-id="${field}"]`);
  /** A block pasted on the grid, as a spreadsheet's Ctrl+C then Ctrl+V gives it. */
  const paste = async (block: string) => {
    const event = new Event('paste', { bubbles: true, cancelable: true });
    Object.defineProperty(event, 'clipboardData', { value: { getData: (type: string) => (type === 'text/plain' ? block : '') } });
    el.querySelector('[data-testid="specimen-grid"]')!.dispatchEvent(event);
    await fixture.whenStable();
    await wait(50);
    await fixture.whenStable();
  };
  return { fixture, el, text, grid, cell, paste };
}

describe('SpecimensTab with its grid', () => {
  afterEach(() => httpController().verify());

  it('shows the saved rows as entered, their count and the saved state', async () => {
    const { grid, text, el } = await mount(['technologist']);
    expect(grid().map((r) => [r['position'], r['label'], r['comparative'], r['candidate']])).toEqual(
      glucoseRows(40).slice(0, 5).map((r) => [String(r.position), r.label, r.comparativeText, r.candidateText]),
    );
    expect(grid()[0]).toMatchObject({ label: 'G01', comparative: '3.0', candidate: '3.1' });
    expect(text('row-count')).toBe('5 rows');
    expect(text('save-state')).toBe('Saved');
    expect(text('problems')).toBeNull();
    expect(el.querySelector('[data-testid="row-add"]')).not.toBeNull();
    expect((el.querySelector('[data-testid="upload-open"]') as HTMLButtonElement).disabled).toBe(false);
  });

  it('appends a pasted block, names the row and field a local check refuses, and shows the server’s refusal of the same cell', async () => {
    const { fixture, grid, text, cell, paste, el } = await mount(['technologist']);
    await paste('G06\t5.4\t5.6\nG07\t5.9\tn/a\n');
    expect(grid().slice(5).map((r) => [r['position'], r['label'], r['comparative'], r['candidate']])).toEqual([
      ['6', 'G06', '5.4', '5.6'], ['7', 'G07', '5.9', 'n/a'],
    ]);
    expect(text('row-count')).toBe('7 rows');
    expect(el.querySelector('[data-testid="problems"] div')?.textContent?.replace(/\s+/g, ' ').trim()).toBe('1 problem: row 7: candidate result "n/a" is not a number');
    expect(cell(6, 'candidate')!.classList.contains('cell-problem')).toBe(true);
    expect(cell(5, 'candidate')!.classList.contains('cell-problem')).toBe(false);
    // Not saved yet (or on its way, on a slow machine): no import meanwhile.
    expect(['Changes not saved yet', 'Saving…']).toContain(text('save-state'));
    expect((el.querySelector('[data-testid="upload-open"]') as HTMLButtonElement).disabled).toBe(true);
    const put = await autosave(fixture);
    const sent = put.request.body as { version: number; rows: { label: string; comparative: string; candidate: string }[] };
    expect(sent.version).toBe(4);
    expect(sent.rows.slice(5)).toEqual([
      expect.objectContaining({ label: 'G06', comparative: '5.4', candidate: '5.6' }), expect.objectContaining({ label: 'G07', comparative: '5.9', candidate: 'n/a' }),
    ]);
    const issue = { path: 'rows.6.candidate', message: 'row 7: candidate result "n/a" is not a number' };
    put.flush(apiError(issue.message, [issue]), { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(text('save-state')).toBe('Not saved: row 7: candidate result "n/a" is not a number');
    expect(cell(6, 'candidate')!.classList.contains('cell-problem')).toBe(true);
  });

  it('saves a good paste and follows the study to its new version', async () => {
    const { fixture, text, paste } = await mount(['technologist']);
    await paste('G06\t5.4\t5.6\n');
    const put = await autosave(fixture);
    put.flush(specimensAnswer(glucoseRows(40).slice(0, 6), 5));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ n: 6, version: 5, findings: 'out-of-date' }));
    await fixture.whenStable();
    expect(text('save-state')).toBe('Saved');
    expect(TestBed.inject(StudyStore).study()?.version).toBe(5);
    expect(TestBed.inject(StudyStore).study()?.n).toBe(6);
  });

  it('undoes a paste with Ctrl+Z and makes it again with Ctrl+Y, saving the rows as they stand', async () => {
    const { fixture, el, grid, text, paste } = await mount(['technologist']);
    await paste('G06\t5.4\t5.6\n');
    expect(grid()).toHaveLength(6);
    const press = async (key: string) => {
      el.querySelector('[data-testid="specimen-grid"]')!.dispatchEvent(new KeyboardEvent('keydown', { key, ctrlKey: true, bubbles: true, cancelable: true }));
      await fixture.whenStable();
      await wait(50);
      await fixture.whenStable();
    };
    await press('z');
    expect(grid().map((r) => r['label'])).toEqual(['G01', 'G02', 'G03', 'G04', 'G05']);
    expect(text('row-count')).toBe('5 rows');
    await press('y');
    expect(grid().map((r) => r['label'])).toEqual(['G01', 'G02', 'G03', 'G04', 'G05', 'G06']);
    const put = await autosave(fixture);
    expect((put.request.body as { rows: unknown[] }).rows).toHaveLength(6);
    put.flush(specimensAnswer(glucoseRows(40).slice(0, 6), 5));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ n: 6, version: 5 }));
  });

  it('gives a reader without an entering role the rows only: no toolbar, no import, no save state', async () => {
    const { el, grid, text } = await mount(['quality']);
    expect(grid()).toHaveLength(5);
    expect(el.querySelector('[data-testid="row-add"]')).toBeNull();
    expect(el.querySelector('[data-testid="upload-open"]')).toBeNull();
    expect(text('save-state')).toBeNull();
  });

  it('names the error when the rows cannot be read', async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['technologist'])), StudyStore, SpecimensStore] });
    await restoreSession();
    TestBed.inject(StudyStore).adopt(glucoseStudy());
    const fixture = TestBed.createComponent(SpecimensTab);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/specimens').flush(apiError('The database is not answering; try again in a moment'), { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="banner"] span')?.textContent).toBe('The database is not answering; try again in a moment');
  });
});
