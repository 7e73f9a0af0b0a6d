import { AppError } from '../http/app-error';
import type { StudyRow } from './studies.repository';

/** Rows and settings change only in draft. */
export function assertEditable(study: StudyRow): void {
  if (study.state !== 'draft') {
    const why = study.state === 'signed' ? 'it is signed; amend it to make a new draft' : 'it has been submitted for sign-off';
    throw new AppError('conflict', `This study cannot be changed: ${why}`);
  }
}
