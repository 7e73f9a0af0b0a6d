import ExcelJS from 'exceljs';
import { eq } from 'drizzle-orm';
import { specimens, uploads } from '../db/schema';
import { sha256Hex } from '../audit/canonical-json';
import { createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

async function workbook(fill: (sheet: ExcelJS.Worksheet) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  fill(wb.addWorksheet('Results'));
  return Buffer.from(await wb.xlsx.writeBuffer());
}

async function setup() {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech);
  const upload = (name: string, bytes: Buffer) =>
    tech.agent.post(`/api/v1/studies/${study.id}/uploads`).set('X-XSRF-TOKEN', tech.xsrf).attach('file', bytes, name);
  return { tech, study, upload };
}

describe('uploads', () => {
  it('reads an .xlsx, previews its columns, stores the original with its SHA-256, and imports with a mapping', async () => {
    const { tech, study, upload } = await setup();
    const pairs = inventedPairs(12);
    const bytes = await workbook((s) => {
      s.addRow(['Specimen', 'Current analyzer', 'New analyzer', 'Comment']);
      pairs.forEach((p) => s.addRow([p.label, Number(p.comparative), Number(p.candidate), '']));
    });
    const preview = await upload('pairs.xlsx', bytes).expect(201);
    expect(preview.body).toMatchObject({ columns: ['Specimen', 'Current analyzer', 'New analyzer', 'Comment'], rowCount: 12, sha256: sha256Hex(bytes) });
    expect(preview.body.suggestedMapping).toEqual({ label: 'Specimen', comparative: 'Current analyzer', candidate: 'New analyzer', note: 'Comment' });
    const [stored] = await h.database.db.select().from(uploads).where(eq(uploads.id, preview.body.uploadId));
    expect(Buffer.compare(stored.bytes, bytes)).toBe(0);
    const imported = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${preview.body.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, mode: 'replace', mapping: preview.body.suggestedMapping }).expect(200);
    expect(imported.body.rows).toHaveLength(12);
    expect(imported.body.rows.every((r: { uploadId: number }) => r.uploadId === preview.body.uploadId)).toBe(true);
    const again = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${preview.body.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: imported.body.version, mode: 'append', mapping: preview.body.suggestedMapping }).expect(200);
    expect(again.body.rows).toHaveLength(24);
  });

  it('reads a semicolon CSV with decimal commas and a tab-separated text without a header', async () => {
    const { upload } = await setup();
    const csv = await upload('pairs.csv', Buffer.from('specimen;x;y\nA1;5,2;5,3\nA2;7,9;8,1\n')).expect(201);
    expect(csv.body).toMatchObject({ columns: ['specimen', 'x', 'y'], preview: [['A1', '5,2', '5,3'], ['A2', '7,9', '8,1']] });
    expect(csv.body.suggestedMapping).toMatchObject({ label: 'specimen', comparative: 'x', candidate: 'y' });
    const tsv = await upload('pairs.txt', Buffer.from('4.1\t4.3\n6.0\t6.2\n')).expect(201);
    expect(tsv.body.columns).toEqual(['Column A', 'Column B']);
    expect(tsv.body.suggestedMapping).toMatchObject({ comparative: 'Column A', candidate: 'Column B' });
  });

  it('refuses bad files with a clear error and changes nothing', async () => {
    const { tech, study, upload } = await setup();
    const cases: [string, Buffer, RegExp][] = [
      ['notes.pdf', Buffer.from('%PDF-1.7'), /cannot be read; upload \.xlsx, \.csv/],
      ['empty.csv', Buffer.alloc(0), /empty/],
      ['words.csv', Buffer.from('a,b\nx,y\n'), /No column of the file holds numbers/],
      ['fake.xlsx', Buffer.from('plain text'), /not an Excel workbook/],
      ['big.csv', Buffer.from(['x,y', ...Array.from({ length: 10001 }, (_, i) => `${i},${i}`)].join('\n')), /more than 10,000 data rows; at most 10,000 can be imported/],
      ['errors.xlsx', await workbook((s) => { s.addRow(['x', 'y']); s.addRow([1, { formula: '1/0', result: { error: '#DIV/0!' } }]); }), /column B: the formula gives the error #DIV\/0!/],
    ];
    for (const [name, bytes, message] of cases) {
      const res = await upload(name, bytes).expect(400);
      expect(res.body.error).toMatch(message);
    }
    expect(await h.database.db.select().from(uploads).where(eq(uploads.studyId, study.id))).toEqual([]);
    const huge = await upload('huge.csv', Buffer.alloc(5 * 1024 * 1024 + 10, 49)).expect(413);
    expect(huge.body.error).toMatch(/5 MB/);
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`)).body.version).toBe(1);
  });

  it('refuses a file name with a control character, naming the file, and stores nothing', async () => {
    const { tech, study, upload } = await setup();
    // Raw, the multipart parser itself refuses the header.
    const nul = await upload('pairs\u0000.csv', Buffer.from('x,y\n1,2\n')).expect(400);
    expect(nul.body.issues[0]).toMatchObject({ path: 'file', message: expect.stringMatching(/file's name is malformed \(for example a control character in the name\)/) });
    // Percent-encoded (RFC 5987 filename*), it arrives decoded and is refused by name.
    const boundary = 'parallax-test-boundary';
    const body = Buffer.from([
      `--${boundary}`, `Content-Disposition: form-data; name="file"; filename*=UTF-8''pairs%07.csv`, 'Content-Type: text/csv', '', 'x,y', '1,2', `--${boundary}--`, '',
    ].join('\r\n'));
    const encoded = await tech.agent.post(`/api/v1/studies/${study.id}/uploads`).set('X-XSRF-TOKEN', tech.xsrf)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(body).expect(400);
    expect(encoded.body.issues[0]).toEqual({ path: 'file', message: 'file: contains a control character (U+0007); remove it' });
    expect(await h.database.db.select().from(uploads).where(eq(uploads.studyId, study.id))).toEqual([]);
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`)).body.version).toBe(1);
  });

  it('warns when a file repeats the study\'s labels and, when it repeats most of them, suggests replacing the rows', async () => {
    const { tech, study, upload } = await setup();
    const csv = (pairs: { label: string; comparative: string; candidate: string }[]) =>
      Buffer.from(['Individual,Current,New,Comment', ...pairs.map((p) => `${p.label},${p.comparative},${p.candidate},`)].join('\n'));
    const pairs = inventedPairs(45);
    const first = (await upload('run.csv', csv(pairs)).expect(201)).body;
    expect(first).toMatchObject({ suggestedMapping: { label: 'Individual', comparative: 'Current', candidate: 'New', note: 'Comment' }, warnings: [], labelChecks: {}, suggestedMode: 'replace' });
    const imported = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${first.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, mode: 'replace', mapping: first.suggestedMapping }).expect(200);
    expect(imported.body.warnings).toEqual([]);

    const again = (await upload('run.csv', csv(pairs)).expect(201)).body;
    const repeats = '45 rows repeat labels already in the study (S001, S002, S003, S004, S005 and 40 more)';
    expect(again.warnings).toEqual([repeats]);
    expect(again.labelChecks.Individual).toEqual({ warnings: [repeats], repeatsMostOfStudy: true });
    expect(again.suggestedMode).toBe('replace');

    const few = (await upload('more.csv', csv([pairs[2], ...inventedPairs(6).map((p) => ({ ...p, label: `N${p.label}` })), { ...pairs[0], label: 'NS001' }])).expect(201)).body;
    expect(few.warnings).toEqual(['1 row repeats a label already in the study (S003)', 'Label NS001 appears more than once in the file (2 rows)']);
    expect(few.suggestedMode).toBe('append');

    const doubled = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${again.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: imported.body.version, mode: 'append', mapping: again.suggestedMapping }).expect(200);
    expect(doubled.body.rows).toHaveLength(90);
    expect(doubled.body.warnings).toEqual(['Labels S001, S002, S003, S004, S005 and 40 more appear more than once (90 rows); give each specimen its own label, or exclude the extra rows with a reason']);
  });

  it('says which fields the suggested mapping leaves unmapped', async () => {
    const { upload } = await setup();
    const preview = (await upload('pairs.csv', Buffer.from('Current,New\n5.1,5.2\n6.0,6.1\n')).expect(201)).body;
    expect(preview.suggestedMapping).toEqual({ comparative: 'Current', candidate: 'New' });
    expect(preview.warnings).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
      'Not mapped: note — no column of the file is chosen for it; the rows come in without it',
    ]);
  });

  it('refuses an import whose rows are bad, naming the file row, and keeps the grid as it was', async () => {
    const { tech, study, upload } = await setup();
    const preview = (await upload('pairs.csv', Buffer.from('id,x,y\nB1,5.1,5.2\nB2,oops,5.0\n')).expect(201)).body;
    const res = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${preview.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, mode: 'replace', mapping: { label: 'id', comparative: 'x', candidate: 'y' } }).expect(400);
    expect(res.body.error).toMatch(/file row 3: comparative result "oops" is not a number/);
    const missing = await tech.agent.post(`/api/v1/studies/${study.id}/uploads/${preview.uploadId}/import`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, mode: 'replace', mapping: { comparative: 'x', candidate: 'nope' } }).expect(400);
    expect(missing.body.issues[0].path).toBe('mapping.candidate');
    expect(await h.database.db.select().from(specimens).where(eq(specimens.studyId, study.id))).toEqual([]);
  });
});
