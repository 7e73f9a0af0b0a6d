import ExcelJS from 'exceljs';
import { eq, inArray } from 'drizzle-orm';
import { laboratoryDate, laboratoryTime } from '@shared/types/lab-time';
import { laboratories, mailMessages, mailOutbox, studies } from '../db/schema';
import { analysedComparison, createComparison } from '../test/fixtures';
import { anonymous, binary, Harness, signedIn, startHarness, uniqueEmail, signedStudy } from '../test/harness';

/**
 * One clock: the laboratory's zone (Vale Harbor keeps America/Halifax) governs the date filters of the
 * study list, the archive and the history, the exports' times, the e-mails, and the password link.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const HALIFAX = 'America/Halifax';
type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);


/**
 * Four drafts around the start of summer time in Halifax (2026-03-08, clocks 02:00 AST → 03:00 ADT),
 * with the chosen column set to: 23:30 AST on the 7th (already the 8th in UTC), 00:30 AST on the 8th,
 * 23:30 ADT on the 8th (already the 9th in UTC) and 00:30 ADT on the 9th.
 */
const AROUND_MARCH_8 = ['2026-03-08T03:30:00Z', '2026-03-08T04:30:00Z', '2026-03-09T02:30:00Z', '2026-03-09T03:30:00Z'];
async function draftsAroundMarch8(tag: string, column: 'updatedAt' | 'createdAt'): Promise<number[]> {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const ids: number[] = [];
  for (const [i, at] of AROUND_MARCH_8.entries()) {
    const { id } = await createComparison(h, tech, `${tag} ${i}`);
    await h.database.db.update(studies).set({ [column]: new Date(at) }).where(eq(studies.id, id));
    ids.push(id);
  }
  return ids;
}

const valeHarbor = async () => (await h.database.db.select().from(laboratories).where(eq(laboratories.name, 'Vale Harbor Regional Laboratory')))[0];

describe("date filters count the laboratory's days", () => {
  it('the study list "from 2026-03-08 to 2026-03-08" keeps 00:30 and 23:30 Halifax time and leaves out the UTC day\'s other ends', async () => {
    const tag = `Clock list ${Date.now()}`;
    const [lateOn7th, earlyOn8th, lateOn8th, earlyOn9th] = await draftsAroundMarch8(tag, 'updatedAt');
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const ids = async (query: object) => ((await tech.agent.get('/api/v1/studies').query({ q: tag, sort: 'updatedAt', order: 'asc', ...query }).expect(200)).body.items as { id: number }[]).map((s) => s.id);
    expect(await ids({ from: '2026-03-08', to: '2026-03-08' })).toEqual([earlyOn8th, lateOn8th]);
    expect(await ids({ to: '2026-03-07' })).toEqual([lateOn7th]);
    expect(await ids({ from: '2026-03-09' })).toEqual([earlyOn9th]);
  });

  it('the archive\'s "created between" means Halifax days too, and a day that does not exist is refused by name', async () => {
    const tag = `Clock archive ${Date.now()}`;
    const [lateOn7th, earlyOn8th, lateOn8th, earlyOn9th] = await draftsAroundMarch8(tag, 'createdAt');
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const ids = async (query: object) => ((await quality.agent.get('/api/v1/archive').query({ q: tag, sort: 'createdAt', order: 'asc', ...query }).expect(200)).body.items as { id: number }[]).map((s) => s.id);
    expect(await ids({ createdFrom: '2026-03-08', createdTo: '2026-03-08' })).toEqual([earlyOn8th, lateOn8th]);
    expect(await ids({ createdTo: '2026-03-07' })).toEqual([lateOn7th]);
    expect(await ids({ createdFrom: '2026-03-09' })).toEqual([earlyOn9th]);
    const bad = await quality.agent.get('/api/v1/archive').query({ createdTo: '2026-02-30' }).expect(400);
    expect(bad.body.issues).toEqual([{ path: 'createdTo', message: 'There is no such day; use a date like 2026-11-30' }]);
  });

  it("the archive's signed dates and the laboratory history follow the laboratory's zone, not the UTC day", async () => {
    const id = await signedStudy(h, `Clock signed ${Date.now()}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const [signature] = (await quality.agent.get(`/api/v1/studies/${id}/signatures`).expect(200)).body as { signedAt: string }[];
    const signedAt = new Date(signature.signedAt);
    // A zone in which the signature's local day is not its UTC day, whatever the hour the test runs.
    const zone = signedAt.getUTCHours() >= 12 ? 'Pacific/Kiritimati' : 'Etc/GMT+12';
    const localDay = laboratoryDate(signedAt, zone);
    const utcDay = signature.signedAt.slice(0, 10);
    expect(localDay).not.toBe(utcDay);
    const lab = await valeHarbor();
    await h.database.db.update(laboratories).set({ timeZone: zone }).where(eq(laboratories.id, lab.id));
    try {
      const archived = async (day: string) => (await quality.agent.get('/api/v1/archive').query({ signedFrom: day, signedTo: day, pageSize: 500 }).expect(200)).body.items.map((s: { id: number }) => s.id);
      expect(await archived(localDay)).toContain(id);
      expect(await archived(utcDay)).not.toContain(id);
      const all = (await quality.agent.get(`/api/v1/studies/${id}/history`).expect(200)).body as { at: string }[];
      const history = async (day: string) => (await quality.agent.get('/api/v1/audit').query({ studyId: id, from: day, to: day }).expect(200)).body.total;
      expect(await history(localDay)).toBe(all.filter((e) => laboratoryDate(e.at, zone) === localDay).length);
      expect(await history(localDay)).toBeGreaterThan(0);
      expect(await history(utcDay)).toBe(all.filter((e) => laboratoryDate(e.at, zone) === utcDay).length);
    } finally {
      await h.database.db.update(laboratories).set({ timeZone: lab.timeZone }).where(eq(laboratories.id, lab.id));
    }
  });
});

/** A sheet's rows as objects keyed by the header row. */
function table(ws: ExcelJS.Worksheet): Record<string, unknown>[] {
  const headers = (ws.getRow(1).values as unknown[]).slice(1).map(String);
  const out: Record<string, unknown>[] = [];
  ws.eachRow((row, n) => {
    if (n > 1) out.push(Object.fromEntries(headers.map((header, i) => [header, row.getCell(i + 1).value])));
  });
  return out;
}

describe('exports keep the UTC instant beside the laboratory time', () => {
  it('writes every time twice in the archive list and in the study record: Halifax time with its zone named, and the UTC instant', async () => {
    const title = `Clock export ${Date.now()}`;
    const id = await signedStudy(h, title);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const [item] = (await quality.agent.get('/api/v1/archive').query({ q: title }).expect(200)).body.items as { signedAt: string; createdAt: string }[];

    const list = new ExcelJS.Workbook();
    await list.xlsx.load((await quality.agent.get('/api/v1/archive/export.xlsx').query({ q: title }).buffer(true).parse(binary).expect(200)).body);
    const [row] = table(list.getWorksheet('Studies')!);
    expect(row['Signed at (laboratory time)']).toBe(laboratoryTime(item.signedAt, HALIFAX));
    expect(row['Signed at (laboratory time)']).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d America\/Halifax \(UTC−0[34]:00\)$/);
    expect(row['Signed at (UTC)']).toBe(item.signedAt);
    expect(row['Signed at (UTC)']).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    expect(row['Created (laboratory time)']).toBe(laboratoryTime(item.createdAt, HALIFAX));
    expect(row['Created (UTC)']).toBe(item.createdAt);

    const record = new ExcelJS.Workbook();
    await record.xlsx.load((await quality.agent.get(`/api/v1/studies/${id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body);
    const [signature] = table(record.getWorksheet('Signatures')!);
    expect(signature['Signed at (laboratory time)']).toBe(laboratoryTime(item.signedAt, HALIFAX));
    expect(signature['Signed at (UTC)']).toBe(item.signedAt);
    const history = table(record.getWorksheet('Audit history')!);
    const events = (await quality.agent.get(`/api/v1/studies/${id}/history`).expect(200)).body as { at: string }[];
    expect(history.map((e) => e['Time (UTC)'])).toEqual(events.map((e) => e.at));
    expect(history.map((e) => e['Time (laboratory time)'])).toEqual(events.map((e) => laboratoryTime(e.at, HALIFAX)));
  });
});

describe('the verification code printed on a signed PDF', () => {
  it('finds its study in the archive search, typed as printed, in lower case, without separators or without PX', async () => {
    const id = await signedStudy(h, `Clock code ${Date.now()}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const signatures = (await quality.agent.get(`/api/v1/studies/${id}/signatures`).expect(200)).body as { verificationCode: string }[];
    const code = signatures[signatures.length - 1].verificationCode;
    expect(code).toMatch(/^PX-[A-Z2-9]{4}-[A-Z2-9]{4}$/);
    const found = async (q: string) => (await quality.agent.get('/api/v1/archive').query({ q }).expect(200)).body.items.map((s: { id: number }) => s.id);
    const bare = code.replace(/-/g, '');
    for (const typed of [code, code.toLowerCase(), bare, bare.toLowerCase(), ` ${code.slice(3).toLowerCase().replace('-', ' ')} `, code.replace(/-/g, '.')]) {
      expect(await found(typed)).toEqual([id]);
    }
    // One character off is another code.
    const other = code.slice(0, -1) + (code.endsWith('A') ? 'B' : 'A');
    expect(await found(other)).not.toContain(id);
    const cedar = await signedIn(h, 'director@cedarpoint.example');
    expect((await cedar.agent.get('/api/v1/archive').query({ q: code }).expect(200)).body.total).toBe(0);
  });
});

describe("e-mails print times in the laboratory's zone, named", () => {
  const HALIFAX_TIME = /\d{4}-\d\d-\d\d \d\d:\d\d America\/Halifax \(UTC−0[34]:00\)/;

  it('tells the directors when a study was submitted and the author when it was signed', async () => {
    const title = `Clock mail ${Date.now()}`;
    await signedStudy(h, title);
    const queued = await h.database.db.select().from(mailOutbox).where(inArray(mailOutbox.subject, [`Awaiting your signature: ${title}`, `Signed: ${title}`]));
    const submitted = queued.find((m) => m.subject.startsWith('Awaiting'))!;
    const signed = queued.find((m) => m.subject.startsWith('Signed'))!;
    expect(submitted.text).toMatch(new RegExp(`\\nSubmitted: ${HALIFAX_TIME.source}\\n`));
    expect(signed.text).toMatch(new RegExp(`\\nWhen: ${HALIFAX_TIME.source}\\n`));
  });

  it("gives the invitation's expiry in the laboratory's zone, and the link's page the zone to show it in", async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const email = uniqueEmail('clock');
    await post(admin, '/users', { name: 'Clock Reader', email, roles: ['technologist'] }).expect(201);
    await h.ctx.mail.flush();
    let mail: typeof mailMessages.$inferSelect | undefined;
    for (let i = 0; i < 50 && !mail; i++) {
      mail = (await h.database.db.select().from(mailMessages)).find((m) => m.to.includes(email));
      if (!mail) await new Promise((r) => setTimeout(r, 100));
    }
    const token = /\/set-password\/([A-Za-z0-9_-]+)/.exec(mail!.text)![1];
    const info = (await (await anonymous(h)).agent.get(`/api/v1/password-links/${token}`).expect(200)).body;
    expect(info.timeZone).toBe(HALIFAX);
    expect(mail!.text).toContain(`expires in 72 hours, at ${laboratoryTime(info.expiresAt, HALIFAX)})`);
  });
});
