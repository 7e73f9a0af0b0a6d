import { HttpErrorResponse } from '@angular/common/http';
import type { ApiErrorBody, ApiIssue } from '@shared/schemas';

/** An API failure in the shape every page handles: the server's words, its field issues, the status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: readonly ApiIssue[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

const FALLBACK: Record<number, string> = {
  0: 'The server cannot be reached. Check the connection and try again.',
  401: 'Please sign in again.',
  403: 'Your roles do not allow this.',
  404: 'This item no longer exists.',
  409: 'Someone else changed this in the meantime. Reload and try again.',
  429: 'Too many attempts. Wait a few minutes and try again.',
};

function isApiErrorBody(body: unknown): body is ApiErrorBody {
  const b = body as Partial<ApiErrorBody> | null;
  return !!b && typeof b.error === 'string' && (b.issues === undefined || Array.isArray(b.issues));
}

/** Turns anything an HTTP call can throw into an ApiError; keeps the server's message when it sent one. */
export function toApiError(err: unknown): ApiError {
  if (err instanceof ApiError) return err;
  if (err instanceof HttpErrorResponse) {
    if (isApiErrorBody(err.error)) return new ApiError(err.status, err.error.error, err.error.issues ?? []);
    const fallback = FALLBACK[err.status] ?? `The server could not do this (error ${err.status}). Try again later.`;
    const text = typeof err.error === 'string' && err.error.length < 300 && err.status === 429 ? err.error : fallback;
    return new ApiError(err.status, text);
  }
  return new ApiError(0, err instanceof Error ? err.message : 'Something went wrong.');
}
