import { and, eq, sql } from 'drizzle-orm';
import type { Tx } from '../db/client';
import { labTimeZone } from '../db/lab-zone';
import { users } from '../db/schema';
import { CAUTION } from '@shared/text/caution';
import { laboratoryTime } from '@shared/types/lab-time';
import { queueMail } from '../mail/outbox';
import type { StudyRow } from '../studies/studies.repository';
import { ownerScope } from '../db/lab-scope';

const link = (publicUrl: string, study: StudyRow, page: string) => `${publicUrl}/studies/${study.id}/${page}`;
/** Now, as the study's laboratory reads it, zone named: the mail is queued in the step's own transaction. */
const now = async (tx: Tx, study: StudyRow) => laboratoryTime(new Date(), await labTimeZone(tx, ownerScope(study)));

export async function labDirectors(tx: Tx, laboratoryId: number) {
  return tx.select().from(users).where(and(eq(users.laboratoryId, laboratoryId), eq(users.active, true), sql`'director' = ANY(${users.roles})`));
}

/** Tells the laboratory's directors that a study awaits their signature, with the submitter's note when there is one. */
export async function notifySubmitted(tx: Tx, study: StudyRow, by: string, publicUrl: string, note = ''): Promise<void> {
  const directors = await labDirectors(tx, study.laboratoryId);
  if (!directors.length) return;
  await queueMail(tx, {
    laboratoryId: study.laboratoryId,
    to: directors.map((d) => d.email),
    subject: `Awaiting your signature: ${study.title}`,
    text: [`${by} submitted the study "${study.title}" for sign-off.`, '', ...(note ? [`Note from ${by}:`, note, ''] : []),
      `Review it here: ${link(publicUrl, study, 'review')}`, `Submitted: ${await now(tx, study)}`, '',
      CAUTION].join('\n'),
  });
}

/** Tells the study's author what the director decided. */
export async function notifyAuthor(tx: Tx, study: StudyRow, subject: string, lines: string[], publicUrl: string): Promise<void> {
  const [author] = await tx.select().from(users).where(eq(users.id, study.createdBy));
  if (!author?.active) return;
  await queueMail(tx, {
    laboratoryId: study.laboratoryId,
    to: [author.email],
    subject: `${subject}: ${study.title}`,
    text: [...lines, `When: ${await now(tx, study)}`, '', `Open the study: ${link(publicUrl, study, 'setup')}`].join('\n'),
  });
}
