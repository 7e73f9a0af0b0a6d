import { TestBed } from '@angular/core/testing';
import type { HistoryEvent } from '@shared/schemas';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { StudyHistory } from './study-history';

const event = (id: number, over: Partial<HistoryEvent> = {}): HistoryEvent => ({
  id, at: '2026-07-01T12:00:00Z', userName: 'Tess Tech', studyId: 5, action: 'specimens.saved', entity: 'study',
  headline: 'Specimen rows saved (40 → 41 rows)', details: ['row 14: candidate result 5.2 → 5.4'], ...over,
});

async function setUp(studyId = 5) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), ...provideSession(sessionUser(['quality']))] });
  await restoreSession();
  const fixture = TestBed.createComponent(StudyHistory);
  fixture.componentRef.setInput('studyId', studyId);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, el };
}

describe('StudyHistory', () => {
  afterEach(() => httpController().verify());

  it('shows each event with the laboratory’s time and zone, who, the headline and its details', async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne('/api/v1/studies/5/history').flush([event(1), event(2, { userName: null, action: 'analysis.done', headline: 'Analysis finished in 812 ms', details: [] })]);
    await fixture.whenStable();
    const first = el.querySelector('[data-testid="event-1"]') as HTMLElement;
    expect(first.textContent).toContain('2026-07-01 13:00:00 Europe/Lisbon (UTC+01:00)');
    expect(first.textContent).toContain('Tess Tech');
    expect(first.textContent).toContain('Specimen rows saved (40 → 41 rows)');
    expect(first.querySelector('.details')?.textContent).toContain('row 14: candidate result 5.2 → 5.4');
    const second = el.querySelector('[data-testid="event-2"]') as HTMLElement;
    expect(second.textContent).toContain('Parallax (automatic)');
    expect(second.querySelector('.details')).toBeNull();
  });

  it('folds a long list of detail lines until the reader opens it', async () => {
    const { fixture, el } = await setUp();
    const details = Array.from({ length: 8 }, (_, i) => `row ${i + 1} added: specimen label AU-00${i + 1}`);
    httpController().expectOne('/api/v1/studies/5/history').flush([event(1, { details })]);
    await fixture.whenStable();
    const list = el.querySelector('.details') as HTMLElement;
    const more = el.querySelector('.more') as HTMLButtonElement;
    expect(list.classList).toContain('folded');
    expect(list.querySelectorAll('li:not(.extra)')).toHaveLength(5);
    expect(list.querySelectorAll('li')).toHaveLength(8);
    expect(more.textContent?.trim()).toBe('Show all 8 lines');
    more.click();
    await fixture.whenStable();
    expect(list.classList).not.toContain('folded');
    expect(more.textContent?.trim()).toBe('Show fewer lines');
  });

  it('reads the history again when asked and when the study changes', async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne('/api/v1/studies/5/history').flush([]);
    await fixture.whenStable();
    expect(el.textContent).toContain('Nothing has been recorded for this study.');
    (el.querySelector('[data-testid="history-reload"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/5/history').flush([event(3)]);
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="event-3"]')).not.toBeNull();
    fixture.componentRef.setInput('studyId', 8);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/8/history').flush([]);
  });

  it('says in words when the history cannot be read', async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne('/api/v1/studies/5/history').flush(apiError('This item no longer exists.'), { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('The history could not be read: This item no longer exists.');
  });
});
