import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, of } from 'rxjs';
import type { SpecimenRow, SpecimenRows, Study } from '@shared/schemas';
import type { DecimalMark } from '@shared/schemas/result-text';
import { ApiError } from '../../../core/http/api-error';
import { PutSpecimens, SpecimensApi } from '../api/specimens-api';
import { StudyStore } from '../study/study-store';
import { CONFLICT_TEXT } from './save-status';
import { AUTOSAVE_DEBOUNCE_MS, SpecimensStore } from './specimens-store';

function stored(label: string, x: string, y: string): SpecimenRow {
  return {
    position: 1, label, comparative: Number(x), candidate: Number(y), value: null, comparativeText: x, candidateText: y,
    valueText: null, sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '', uploadId: null,
  };
}

describe('SpecimensStore autosave', () => {
  let puts: { body: PutSpecimens; answer: Subject<SpecimenRows> }[];
  let store: SpecimensStore;

  beforeEach(() => {
    jest.useFakeTimers();
    puts = [];
    const api: Partial<SpecimensApi> = {
      get: () => of({ version: 3, rows: [stored('S1', '5.0', '5.2'), stored('S2', '7.0', '7.1')] }),
      put: (_id: number, body: PutSpecimens) => {
        const answer = new Subject<SpecimenRows>();
        puts.push({ body, answer });
        return answer;
      },
    };
    TestBed.configureTestingModule({ providers: [SpecimensStore, { provide: SpecimensApi, useValue: api }] });
    store = TestBed.inject(SpecimensStore);
    store.load(12).subscribe();
  });

  afterEach(() => jest.useRealTimers());

  const uidOf = (i: number): number => store.rows()[i].uid;
  const answer = (i: number, version: number): void => {
    puts[i].answer.next({ version, rows: [] });
    puts[i].answer.complete();
  };
  const fail = (i: number, error: ApiError): void => puts[i].answer.error(error);

  it('waits for a pause in typing, then saves every row once with the version it was edited from', () => {
    store.setCell(uidOf(0), 'candidate', '5.3');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS / 2);
    store.setCell(uidOf(1), 'candidate', '7.2');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS - 1);
    expect(puts).toHaveLength(0);
    expect(store.status()).toBe('pending');
    jest.advanceTimersByTime(1);
    expect(puts).toHaveLength(1);
    expect(puts[0].body.version).toBe(3);
    expect(puts[0].body.rows.map((r) => r['candidate'])).toEqual(['5.3', '7.2']);
    expect(store.status()).toBe('saving');
    answer(0, 4);
    expect(store.status()).toBe('saved');
    expect(store.version()).toBe(4);
  });

  it('on a conflict keeps the rows on screen, says so, and never overwrites the other change', () => {
    store.setCell(uidOf(0), 'candidate', '9.9');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    fail(0, new ApiError(409, 'Someone else changed this study', [{ path: 'version', message: 'You have version 3; the study is at version 4' }]));
    expect(store.status()).toBe('conflict');
    expect(store.message()).toBe(CONFLICT_TEXT);
    expect(store.rows()[0]['candidate']).toBe('9.9');
    store.setCell(uidOf(1), 'note', 'typed after the conflict');
    jest.advanceTimersByTime(60_000);
    store.save();
    expect(puts).toHaveLength(1);
    expect(store.rows()[1]['note']).toBe('typed after the conflict');
  });

  it('on a network failure keeps the rows and retries with growing pauses until the server answers', () => {
    store.setCell(uidOf(0), 'comparative', '5.5');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    fail(0, new ApiError(0, 'The server cannot be reached.'));
    expect(store.status()).toBe('offline');
    expect(store.rows()[0]['comparative']).toBe('5.5');
    jest.advanceTimersByTime(999);
    expect(puts).toHaveLength(1);
    jest.advanceTimersByTime(1);
    expect(puts).toHaveLength(2);
    fail(1, new ApiError(503, 'Unavailable'));
    jest.advanceTimersByTime(1999);
    expect(puts).toHaveLength(2);
    jest.advanceTimersByTime(1);
    expect(puts).toHaveLength(3);
    expect(puts[2].body.rows[0]['comparative']).toBe('5.5');
    answer(2, 4);
    expect(store.status()).toBe('saved');
  });

  it('shows the refused row in grid numbering, keeps the rows, and saves again after the fix', () => {
    store.insertRow(1);
    store.setCell(uidOf(2), 'candidate', '7,x');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts[0].body.rows).toHaveLength(2);
    fail(0, new ApiError(400, 'Some rows are not valid', [{ path: 'rows.1.candidate', message: 'row 2: candidate result is not a number' }]));
    expect(store.status()).toBe('invalid');
    expect(store.message()).toBe('row 3: candidate result is not a number');
    expect(store.issues()).toEqual([{ rowIndex: 2, field: 'candidate', message: 'row 3: candidate result is not a number' }]);
    jest.advanceTimersByTime(60_000);
    expect(puts).toHaveLength(1);
    store.setCell(uidOf(2), 'candidate', '7.3');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts).toHaveLength(2);
    answer(1, 4);
    expect(store.status()).toBe('saved');
    expect(store.issues()).toEqual([]);
  });

  it('saves edits made while a save was on its way right after it returns', () => {
    store.setCell(uidOf(0), 'note', 'first');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    store.setCell(uidOf(0), 'note', 'second');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts).toHaveLength(1);
    answer(0, 4);
    expect(puts).toHaveLength(2);
    expect(puts[1].body.version).toBe(4);
    expect(puts[1].body.rows[0]['note']).toBe('second');
    answer(1, 5);
    expect(store.status()).toBe('saved');
  });

  it('keeps a result typed with a decimal comma with a point, and leaves a typing error as typed', () => {
    store.setCell(uidOf(0), 'candidate', '5,35');
    store.setCell(uidOf(1), 'candidate', '7,x');
    store.setCell(uidOf(1), 'note', 'a,b');
    expect(store.rows()[0]['candidate']).toBe('5.35');
    expect(store.rows()[1]['candidate']).toBe('7,x');
    expect(store.rows()[1]['note']).toBe('a,b');
  });

  it('excludes a row with its reason and saves at once', () => {
    store.exclude(1, 'clotted specimen');
    expect(puts).toHaveLength(1);
    expect(puts[0].body.rows[1]).toMatchObject({ excluded: true, exclusionReason: 'clotted specimen' });
  });

  it('undoes a typed value and saves the rows as they were, then redoes it and saves that', () => {
    expect(store.canUndo()).toBe(false);
    store.setCell(uidOf(0), 'candidate', '5.9');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    answer(0, 4);
    expect(store.undo()).toBe(true);
    expect(store.rows()[0]['candidate']).toBe('5.2');
    expect(store.status()).toBe('pending');
    expect(store.canRedo()).toBe(true);
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts).toHaveLength(2);
    expect(puts[1].body).toMatchObject({ version: 4 });
    expect(puts[1].body.rows.map((r) => r['candidate'])).toEqual(['5.2', '7.1']);
    answer(1, 5);
    expect(store.redo()).toBe(true);
    expect(store.rows()[0]['candidate']).toBe('5.9');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts[2].body.rows.map((r) => r['candidate'])).toEqual(['5.9', '7.1']);
    expect(store.redo()).toBe(false);
  });

  it('undoes a deletion of several rows and a paste as one step each', () => {
    store.deleteRows(new Set([uidOf(0), uidOf(1)]));
    expect(store.rows()).toHaveLength(0);
    store.undo();
    expect(store.rows().map((r) => r['label'])).toEqual(['S1', 'S2']);
    store.paste({ rowIndex: 0, field: 'label' }, 'P1\t1.0\t1.1\nP2\t2.0\t2.1\nP3\t3.0\t3.1');
    expect(store.rows().map((r) => r['label'])).toEqual(['P1', 'P2', 'P3']);
    store.undo();
    expect(store.rows().map((r) => r['label'])).toEqual(['S1', 'S2']);
    expect(store.rows().map((r) => r['candidate'])).toEqual(['5.2', '7.1']);
  });

  it('makes no step for a cell typed over with the same value, and forgets the steps when rows are loaded again', () => {
    store.setCell(uidOf(0), 'label', 'S1');
    expect(store.canUndo()).toBe(false);
    expect(store.status()).toBe('saved');
    store.setCell(uidOf(0), 'label', 'S1b');
    expect(store.canUndo()).toBe(true);
    store.load(12).subscribe();
    expect(store.canUndo()).toBe(false);
    expect(store.undo()).toBe(false);
  });

  it("puts deleted rows back from the snack bar as a step back, or as a new change once something else was edited", () => {
    const before = store.rows();
    store.deleteRows(new Set([uidOf(1)]));
    store.undoDeletion(before);
    expect(store.rows().map((r) => r['label'])).toEqual(['S1', 'S2']);
    expect(store.canRedo()).toBe(true);

    const again = store.rows();
    store.deleteRows(new Set([uidOf(0)]));
    store.setCell(uidOf(0), 'note', 'typed after the deletion');
    store.undoDeletion(again);
    expect(store.rows().map((r) => r['label'])).toEqual(['S1', 'S2']);
    expect(store.canRedo()).toBe(false);
    store.undo();
    expect(store.rows().map((r) => [r['label'], r['note']])).toEqual([['S2', 'typed after the deletion']]);
  });
});

describe("SpecimensStore and the study's decimal mark", () => {
  let puts: PutSpecimens[];
  let store: SpecimensStore;
  const mark = signal<DecimalMark>('comma');

  beforeEach(() => {
    jest.useFakeTimers();
    puts = [];
    mark.set('comma');
    const api: Partial<SpecimensApi> = {
      get: () => of({ version: 3, rows: [stored('S1', '1.234', '5.20'), stored('S2', '1234.5', '7')] }),
      put: (_id: number, body: PutSpecimens) => {
        puts.push(body);
        return new Subject<SpecimenRows>();
      },
    };
    const study = { study: () => ({ id: 12, settings: { decimalMark: mark() } }) as unknown as Study, versionMoves: new Subject(), followVersion: () => undefined };
    TestBed.configureTestingModule({ providers: [SpecimensStore, { provide: SpecimensApi, useValue: api }, { provide: StudyStore, useValue: study }] });
    store = TestBed.inject(SpecimensStore);
    TestBed.tick();
    store.load(12).subscribe();
  });

  afterEach(() => jest.useRealTimers());

  const cells = () => store.rows().map((r) => [r['comparative'], r['candidate']]);

  it('shows stored results written with a comma, and sends them so, so the server reads the same numbers', () => {
    expect(store.decimalMark()).toBe('comma');
    expect(cells()).toEqual([['1,234', '5,20'], ['1234,5', '7']]);
    store.setCell(store.rows()[1].uid, 'candidate', '1.234,50');
    expect(store.rows()[1]['candidate']).toBe('1234,50');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts[0].rows.map((r) => [r['comparative'], r['candidate']])).toEqual([['1,234', '5,20'], ['1234,5', '1234,50']]);
  });

  it('rewrites the rows when the mark changes, keeping every number and saving nothing for it', () => {
    mark.set('auto');
    TestBed.tick();
    expect(store.decimalMark()).toBe('auto');
    expect(cells()).toEqual([['1.234', '5.20'], ['1234.5', '7']]);
    expect(store.status()).toBe('saved');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts).toHaveLength(0);
  });
});
