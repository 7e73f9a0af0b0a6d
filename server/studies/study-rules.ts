import { eq } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { laboratories } from '../db/schema';
import { AppError } from '../http/app-error';
import type { StudyRow } from './studies.repository';

/** Rows and settings change only in draft. */
export function assertEditable(study: StudyRow): void {
  if (study.state !== 'draft') {
    const why = study.state === 'signed' ? 'it is signed; amend it to make a new draft' : 'it has been submitted for sign-off';
    throw new AppError('conflict', `This study cannot be changed: ${why}`);
  }
}

/** Where the laboratory requires it, specimens wait for the director's approval of the plan. */
export async function assertPlanApproved(db: Executor, study: StudyRow): Promise<void> {
  if (study.planApprovedAt) return;
  const [lab] = await db.select({ required: laboratories.planApprovalRequired }).from(laboratories).where(eq(laboratories.id, study.laboratoryId));
  if (lab.required) throw new AppError('conflict', 'This laboratory requires the director to approve the plan before specimens are entered');
}
