import { eq } from 'drizzle-orm';
import type { Study } from '@shared/schemas';
import type { Executor } from '../db/client';
import { users } from '../db/schema';
import type { StudyRow } from '../studies/studies.repository';

/**
 * The note the technologist sent with the submission, with who sent it and when, for the study's view; null
 * without one (none was given, or the study was returned, which clears it). One query, only when there is a note.
 */
export async function submissionNoteOf(db: Executor, row: StudyRow): Promise<Study['submissionNote']> {
  if (!row.submissionNote) return null;
  const [by] = row.submittedBy === null ? [] : await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, row.submittedBy));
  return { text: row.submissionNote, by: by ?? { id: 0, name: 'unknown' }, at: row.submittedAt?.toISOString() ?? null };
}
