import { TestBed } from '@angular/core/testing';
import type { Study } from '@shared/schemas';
import { provideTestHttp } from '../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../testing/session-users';
import { SubmissionNote } from './submission-note';

async function render(note: Study['submissionNote']) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), ...provideSession(sessionUser(['director']))] });
  await restoreSession();
  const fixture = TestBed.createComponent(SubmissionNote);
  fixture.componentRef.setInput('note', note);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  return (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? null;
}

describe('SubmissionNote', () => {
  it('shows who wrote the note, when it was submitted in the laboratory’s time zone, and its text', async () => {
    const text = await render({ text: 'Rows 12 and 31 were run again.\nThe new lot starts Monday.', by: { id: 3, name: 'Tomas Reyes' }, at: '2026-07-01T12:00:00.000Z' });
    expect(text('submission-note-from')).toBe('Note from Tomas Reyes');
    expect(text('submission-note')).toContain('submitted 2026-07-01 13:00 Europe/Lisbon');
    expect(text('submission-note-text')).toBe('Rows 12 and 31 were run again.\nThe new lot starts Monday.');
  });

  it('shows nothing without a note', async () => {
    const text = await render(null);
    expect(text('submission-note')).toBeNull();
  });
});
