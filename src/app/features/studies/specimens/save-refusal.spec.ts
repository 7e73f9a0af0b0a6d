import { ApiError } from '../../../core/http/api-error';
import { SentRows } from './rows-to-send';
import { refusalOf } from './save-refusal';
import { CONFLICT_TEXT } from './save-status';

const sent: SentRows = { rows: [{}, {}, {}, {}, {}], gridIndex: [0, 1, 2, 3, 4] };
const issue = (row: number) => ({ path: `rows.${row - 1}.candidate`, message: `row ${row}: candidate result is not a number` });

describe('refusalOf', () => {
  it('reads a 409 naming the version as a conflict to reload', () => {
    expect(refusalOf(new ApiError(409, 'Someone else changed this study', [{ path: 'version', message: 'v3' }]), sent)).toEqual({
      status: 'conflict', message: CONFLICT_TEXT, issues: [], retryLater: false,
    });
  });

  it("reads another 409 as a refusal in the server's words, not as a conflict", () => {
    const refusal = refusalOf(new ApiError(409, 'This study cannot be changed: it is signed'), sent);
    expect(refusal).toMatchObject({ status: 'failed', message: 'This study cannot be changed: it is signed', retryLater: false });
  });

  it('names the first refused rows and counts the rest', () => {
    const refusal = refusalOf(new ApiError(400, 'Rows are not valid', [1, 2, 3, 4, 5].map(issue)), sent);
    expect(refusal.status).toBe('invalid');
    expect(refusal.message).toBe(
      'row 1: candidate result is not a number; row 2: candidate result is not a number; row 3: candidate result is not a number; and 2 more',
    );
    expect(refusal.issues).toHaveLength(5);
  });

  it('retries later when the server cannot be reached or fails', () => {
    expect(refusalOf(new ApiError(0, 'The server cannot be reached.'), sent)).toMatchObject({ status: 'offline', retryLater: true });
    expect(refusalOf(new ApiError(502, 'Bad gateway'), sent)).toMatchObject({ status: 'offline', retryLater: true });
  });
});
