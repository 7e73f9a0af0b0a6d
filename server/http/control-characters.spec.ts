import { IdParams } from '@shared/schemas';
import { studies } from '../db/schema';
import { catalogIds, createComparison, inventedPairs } from '../test/fixtures';
import { anonymous, Harness, signedIn, startHarness } from '../test/harness';
import { AppError } from './app-error';
import { controlCharacterIssues } from './control-characters';
import { parseRequest } from './parse-request';

let h: Harness;
let catalog: Awaited<ReturnType<typeof catalogIds>>;
beforeAll(async () => {
  h = await startHarness();
  catalog = await catalogIds(h);
});
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const refusal = (path: string, message: string) => ({ error: message, issues: [{ path, message }] });
const studyCount = async () => (await h.database.db.select({ id: studies.id }).from(studies)).length;
const create = (s: Session, fields: object) =>
  s.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', s.xsrf).send({ kind: 'method-comparison', title: 'Plain title', ...catalog, ...fields });

describe('control characters are refused at the edge with a 400 naming the field', () => {
  it('a NUL in a new study title: 400, no study created', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const before = await studyCount();
    const res = await create(tech, { title: 'Glucose\u0000line 2' }).expect(400);
    expect(res.body).toEqual(refusal('title', 'title: contains a control character (U+0000); remove it'));
    expect(await studyCount()).toBe(before);
  });

  it('a NUL in a changed title: 400, the study unchanged', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech, 'Title before');
    const res = await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, title: 'after\u0000' }).expect(400);
    expect(res.body).toEqual(refusal('title', 'title: contains a control character (U+0000); remove it'));
    const got = await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200);
    expect(got.body).toMatchObject({ title: 'Title before', version: 1 });
  });

  it('a NUL in a row label: 400 naming the row as the grid numbers it, nothing saved', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(3);
    rows[1].label = 'S\u00002';
    const res = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(400);
    expect(res.body).toEqual(refusal('rows.1.label', 'row 2: label contains a control character (U+0000); remove it'));
    expect((await tech.agent.get(`/api/v1/studies/${study.id}/specimens`).expect(200)).body).toEqual({ version: 1, rows: [], warnings: [] });
  });

  it('a NUL in a list search (query string): 400 naming the parameter, never a 500 from the database', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const res = await tech.agent.get('/api/v1/studies?q=%00').expect(400);
    expect(res.body).toEqual(refusal('q', 'q: contains a control character (U+0000); remove it'));
  });

  it('checks every query, even one the route ignores, before the route runs', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const res = await tech.agent.get('/api/v1/worklist?x=a%01b').expect(400);
    expect(res.body).toEqual(refusal('x', 'x: contains a control character (U+0001); remove it'));
    const nobody = await anonymous(h);
    await nobody.agent.get('/api/v1/studies?q=%00').expect(400);
  });

  it('a NUL in a sign-in e-mail: 400, not a 500', async () => {
    const nobody = await anonymous(h);
    const res = await nobody.agent.post('/api/v1/session').set('X-XSRF-TOKEN', nobody.xsrf)
      .send({ email: 'tech\u0000@valeharbor.example', password: 'whatever' }).expect(400);
    expect(res.body.issues).toEqual([{ path: 'email', message: 'email: contains a control character (U+0000); remove it' }]);
  });

  it('a NUL in the address (a route parameter): 400', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const res = await tech.agent.get('/api/v1/studies/1%00').expect(400);
    expect(res.body.issues).toEqual([{ path: 'path', message: 'the address contains a control character (U+0000); remove it' }]);
    await tech.agent.get('/api/v1/password-links/abc%00def').expect(400);
  });

  it('refuses other C0 controls and DEL, nested and in field names, naming each field', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const res = await create(tech, { purpose: 'bell\u0007', settings: { unit: 'mg\u007f', ['see\u001bd']: 'x', outlierRule: 'ok' } }).expect(400);
    expect(res.body.issues).toEqual([
      { path: 'purpose', message: 'purpose: contains a control character (U+0007); remove it' },
      { path: 'settings.unit', message: 'settings.unit: contains a control character (U+007F); remove it' },
      { path: 'settings.see\\u001bd', message: 'settings.see\\u001bd: has a name with a control character (U+001B); remove it' },
    ]);
    expect(res.body.error).toBe('purpose: contains a control character (U+0007); remove it (and 2 more)');
  });

  it('keeps tabs, line feeds and carriage returns (multi-line purposes and notes)', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const res = await create(tech, { purpose: 'First line\r\nSecond\tline\n' }).expect(201);
    expect(res.body.purpose).toBe('First line\r\nSecond\tline\n');
  });
});

describe('the checks themselves', () => {
  it('parseRequest refuses a control character in route parameters, naming the parameter', () => {
    let thrown: unknown;
    try {
      parseRequest(IdParams, { id: '1\u0000' }, 'params');
    } catch (err) {
      thrown = err;
    }
    expect(thrown).toBeInstanceOf(AppError);
    expect((thrown as AppError).issues).toEqual([{ path: 'id', message: 'id: contains a control character (U+0000); remove it' }]);
  });

  it('walks a deeply nested body without overflowing the stack, and stops at 20 issues', () => {
    let deep: unknown = 'x\u0000';
    for (let i = 0; i < 200000; i++) deep = [deep];
    expect(controlCharacterIssues(deep)).toHaveLength(1);
    expect(controlCharacterIssues(Array.from({ length: 50 }, () => '\u0000'))).toHaveLength(20);
    expect(controlCharacterIssues({ a: ['fine\t', { b: 'fine\n\r' }], 'ok key': 1, n: null })).toEqual([]);
  });
});
