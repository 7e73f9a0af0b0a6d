import type { ApiIssue } from '@shared/schemas';

export type ErrorCode =
  | 'invalid_request' | 'unauthenticated' | 'forbidden' | 'not_found' | 'conflict' | 'too_large' | 'locked' | 'too_many' | 'unavailable';

export const STATUS: Record<ErrorCode, number> = {
  invalid_request: 400, unauthenticated: 401, forbidden: 403, not_found: 404, conflict: 409, too_large: 413, locked: 423, too_many: 429, unavailable: 503,
};

/** An error a user can act on: its message is shown as it is. */
export class AppError extends Error {
  constructor(readonly code: ErrorCode, message: string, readonly issues: ApiIssue[] = []) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} was not found`);
export const invalid = (path: string, message: string) => new AppError('invalid_request', message, [{ path, message }]);
