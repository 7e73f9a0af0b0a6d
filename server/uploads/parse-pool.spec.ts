import { AppError } from '../http/app-error';
import { UploadParser } from './parse-pool';
import { SHEET_HEAD, SHEET_TAIL, deflated, workbookParts, writeZip } from './test-workbooks';

// The worker pool itself, with limits small enough to reach in a test: a file that takes too long
// or needs too much memory is a 400 naming the limit, its worker is ended and replaced, and files
// queued behind it are still read.

const csv = Buffer.from('x,y\n1,2\n3,4\n');
/** 10,000 rows of 200 one-digit numbers: 4 MB of text, 2 million cells. */
const wideCsv = () => Buffer.from(Array.from({ length: 10_000 }, (_, r) => Array.from({ length: 200 }, (_, c) => (r + c) % 10).join(',')).join('\n'));
const failure = (p: Promise<unknown>) => p.then(() => null, (e: unknown) => e);

describe('upload worker pool', () => {
  it('ends a file that runs past its time budget with a 400 naming it, then reads the next files', async () => {
    const pool = new UploadParser({ timeMs: 300, memoryMb: 256 });
    try {
      expect((await pool.parse('warm.csv', csv)).rowCount).toBe(2);
      const blank = await deflated(`${SHEET_HEAD}<row><c><v>1</v></c></row>`, '<row/>', 8_000_000, SHEET_TAIL);
      const slow = writeZip([...workbookParts(), { name: 'xl/worksheets/sheet1.xml', data: blank }]);
      const started = Date.now();
      const [err, queued] = await Promise.all([failure(pool.parse('slow.xlsx', slow)), pool.parse('queued.csv', csv)]);
      expect(err).toBeInstanceOf(AppError);
      expect(err).toMatchObject({ code: 'invalid_request', message: expect.stringMatching(/^Reading the file took longer than 0.3 s, the most one file may take/) });
      expect((err as AppError).issues).toEqual([{ path: 'file', message: (err as AppError).message }]);
      expect(Date.now() - started).toBeLessThan(5_000);
      expect(queued.rowCount).toBe(2);
    } finally {
      await pool.close();
    }
  });

  it('ends a file that needs more memory than the worker may use with a 400 naming it, then reads the next files', async () => {
    const pool = new UploadParser({ timeMs: 15_000, memoryMb: 24 });
    try {
      expect((await pool.parse('warm.csv', csv)).rowCount).toBe(2);
      const [err, queued] = await Promise.all([failure(pool.parse('wide.csv', wideCsv())), pool.parse('queued.csv', csv)]);
      expect(err).toBeInstanceOf(AppError);
      expect(err).toMatchObject({ code: 'invalid_request', message: expect.stringMatching(/^Reading the file needed more than 24 MB of memory, the most one file may use/) });
      expect(queued.rowCount).toBe(2);
    } finally {
      await pool.close();
    }
  });

  it('reads the same wide file within the real limits, and hands the table back as JSON', async () => {
    const pool = new UploadParser();
    try {
      const table = await pool.parse('wide.csv', wideCsv());
      expect({ rows: table.rowCount, columns: table.columns.length, sample: table.sample.length }).toEqual({ rows: 10_000, columns: 200, sample: 20 });
      const parsed = JSON.parse(Buffer.from(table.json).toString('utf8'));
      expect(parsed.rows[9_999][199]).toBe(String((9_999 + 199) % 10));
      expect(parsed.hasHeader).toBe(false);
    } finally {
      await pool.close();
    }
  });
});
