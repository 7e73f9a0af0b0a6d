import { ApiError } from '../../core/http/api-error';
import { isVersionConflict } from './version-conflict';

describe('isVersionConflict', () => {
  it('is true for a 409 that names the version', () => {
    expect(isVersionConflict(new ApiError(409, 'Someone else changed this study', [{ path: 'version', message: 'You have version 3' }]))).toBe(true);
  });

  it('is false for other refusals, even with status 409', () => {
    expect(isVersionConflict(new ApiError(409, 'This study cannot be changed: it is signed'))).toBe(false);
    expect(isVersionConflict(new ApiError(400, 'Bad', [{ path: 'version', message: 'Give the version' }]))).toBe(false);
  });
});
