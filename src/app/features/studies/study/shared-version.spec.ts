import { TestBed } from '@angular/core/testing';
import { Subject, of } from 'rxjs';
import type { SpecimenRows, Study } from '@shared/schemas';
import { PutSpecimens, SpecimensApi } from '../api/specimens-api';
import { StudiesApi } from '../api/studies-api';
import { AUTOSAVE_DEBOUNCE_MS, SpecimensStore } from '../specimens/specimens-store';
import { StudyStore } from './study-store';

/** Rows and settings share the study's one version: a save on either tab must not make the other stale. */
describe('the version shared by Setup and Specimens', () => {
  let study: Study;
  let puts: { body: PutSpecimens; answer: Subject<SpecimenRows> }[];
  let gets: number;

  beforeEach(() => {
    jest.useFakeTimers();
    study = { id: 5, version: 3, title: 'T' } as Study;
    puts = [];
    gets = 0;
    const studies: Partial<StudiesApi> = {
      get: () => (gets++, of({ ...study })),
      update: (_id, body) => of({ ...study, ...body, version: body.version + 1 } as Study),
    };
    const specimens: Partial<SpecimensApi> = {
      get: () => of({ version: 3, rows: [] }),
      put: (_id, body) => {
        const answer = new Subject<SpecimenRows>();
        puts.push({ body, answer });
        return answer;
      },
    };
    TestBed.configureTestingModule({
      providers: [StudyStore, SpecimensStore, { provide: StudiesApi, useValue: studies }, { provide: SpecimensApi, useValue: specimens }],
    });
  });

  afterEach(() => jest.useRealTimers());

  it('lets the rows follow a Setup save made on this page, so the next rows save is not refused', () => {
    const store = TestBed.inject(StudyStore);
    const rows = TestBed.inject(SpecimensStore);
    store.load(5);
    rows.load(5).subscribe();
    store.save({ title: 'New title' }).subscribe();
    expect(store.study()?.version).toBe(4);
    expect(rows.version()).toBe(4);
    rows.setCell(rows.rows()[0].uid, 'label', 'S1');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    expect(puts[0].body.version).toBe(4);
  });

  it('lets the study follow a rows save, and reads it again for its new n and findings state', () => {
    const store = TestBed.inject(StudyStore);
    const rows = TestBed.inject(SpecimensStore);
    store.load(5);
    rows.load(5).subscribe();
    const before = gets;
    rows.setCell(rows.rows()[0].uid, 'label', 'S1');
    jest.advanceTimersByTime(AUTOSAVE_DEBOUNCE_MS);
    study = { ...study, version: 4 };
    puts[0].answer.next({ version: 4, rows: [] });
    expect(store.study()?.version).toBe(4);
    expect(gets).toBe(before + 1);
  });
});
