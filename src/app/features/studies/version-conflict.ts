import { ApiError } from '../../core/http/api-error';

/**
 * True when the server refused a change because the study moved on since it was loaded (409 naming
 * the `version`). Other 409s — a signed study, a plan awaiting approval — are refusals in their own words.
 */
export function isVersionConflict(err: ApiError): boolean {
  return err.status === 409 && err.issues.some((issue) => issue.path === 'version' || issue.path.endsWith('.version'));
}
