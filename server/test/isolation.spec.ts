import { ROLES, type Role } from '@shared/schemas';
import { hashPassword } from '../auth/passwords';
import { users } from '../db/schema';
import { DEMO_LABS, DEMO_PASSWORD } from '../db/seed-data';
import type { RouteSpec } from '../http/routes';
import { createComparison, inventedPairs } from './fixtures';
import { apiPost, Harness, Session, signedIn, startHarness } from './harness';

/**
 * Laboratory isolation, walked over the whole route table: every route that takes the id of a record is called
 * by a user of ANOTHER laboratory (Cedar Point), in every role the route allows, with the real ids of Vale
 * Harbor's records (every study of every kind and state, every analysis, release, due item, user, analyte,
 * instrument, an upload, a release's linked study) and a body that would pass validation. Every call must answer
 * 404, exactly as an id that does not exist, and Vale Harbor must be unchanged afterwards, row for row.
 * A route with an id parameter this test does not know fails it until it is added here.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: 'send-only' }); });
afterAll(() => h.close());

type Kind = 'study' | 'analysis' | 'release' | 'due' | 'user' | 'analyte' | 'instrument' | 'upload';

/** Which record a path parameter names: `:id` by the path's first segment, other parameters by their name. */
const ID_OF_SEGMENT: Record<string, Kind> = {
  studies: 'study', analyses: 'analysis', releases: 'release', due: 'due', users: 'user', analytes: 'analyte', instruments: 'instrument',
};
const NAMED_PARAM: Record<string, Kind> = { studyId: 'study', uploadId: 'upload' };

/** Routes with a parameter that is not a laboratory's record, and why they are not walked. */
const NOT_LABORATORY_OWNED: Record<string, string> = {
  'GET /password-links/:token': 'public: the token is a one-time secret e-mailed to one user, not a record of a laboratory, and there is no session to compare laboratories with',
  'POST /password-links/:token': 'public: as above; the token alone names the account whose password is set',
  'PUT /release-templates/:changeType': 'the parameter is one of the fixed change-type words, not a record; the template saved is always the caller\'s laboratory\'s',
};

const key = (r: RouteSpec) => `${r.method.toUpperCase()} ${r.path}`;
const paramsOf = (path: string) => [...path.matchAll(/:(\w+)/g)].map((m) => m[1]);
function kindOf(path: string, param: string): Kind | undefined {
  if (param === 'id') return ID_OF_SEGMENT[path.split('/')[1]];
  return NAMED_PARAM[param];
}

interface Rec { id: number; version?: number; requirement?: string }
type Ids = Partial<Record<Kind, Rec>>;

/**
 * A body each route would accept from its own laboratory, so a missing scope check cannot hide behind a 400
 * (a body that failed its check would answer 400 and fail the walk, so this table cannot go stale unseen).
 */
const BODY: Record<string, (ids: Ids) => object> = {
  'PATCH /users/:id': () => ({ name: 'Isolation probe' }),
  'PUT /analytes/:id': () => ({
    name: 'Isolation probe', unit: 'mmol/L', decimals: 1, decisionLevels: [5], allowableBiasAbsolute: 0.2, allowableBiasPercent: null,
    allowableBiasSource: 'probe', canBeNegative: false, active: true,
  }),
  'PUT /instruments/:id': () => ({ name: 'Isolation probe', model: '', serial: '', location: '', active: true }),
  'PATCH /studies/:id': (ids) => ({ version: ids.study!.version, title: 'Isolation probe' }),
  'PUT /studies/:id/specimens': (ids) => ({ version: ids.study!.version, rows: inventedPairs(3) }),
  'POST /studies/:id/uploads/:uploadId/import': (ids) => ({ version: ids.study!.version, mode: 'replace', mapping: { label: 'Specimen', comparative: 'Current', candidate: 'New' } }),
  'POST /studies/:id/submit': () => ({ note: '' }),
  'POST /studies/:id/return': () => ({ comment: 'Isolation probe' }),
  'POST /studies/:id/sign': () => ({ meaning: 'accepted', comment: '', password: DEMO_PASSWORD }),
  'POST /studies/:id/plan-approval': () => ({ comment: '', password: DEMO_PASSWORD }),
  'POST /studies/:id/amend': () => ({ reason: 'Isolation probe' }),
  'PATCH /releases/:id': (ids) => ({ version: ids.release!.version, title: 'Isolation probe' }),
  'POST /releases/:id/studies': (ids) => ({ requirement: ids.release!.requirement, studyId: cedar.study.id }),
  'POST /releases/:id/waivers': (ids) => ({ requirement: ids.release!.requirement, reason: 'Isolation probe' }),
  'POST /releases/:id/sign': () => ({ meaning: 'released', goLiveDate: null, comment: '', password: DEMO_PASSWORD }),
  'PATCH /due/:id': (ids) => ({ version: ids.due!.version, dueDate: '2027-06-30', reason: 'Isolation probe' }),
  'POST /due/:id/start': () => ({ kind: 'method-comparison', title: 'Isolation probe' }),
};
const CSV = Buffer.from(`Specimen,Current,New\n${inventedPairs(5).map((p) => `${p.label},${p.comparative},${p.candidate}`).join('\n')}\n`);

let labA: number;
let labB: number;
/** Vale Harbor's records, by kind (the ids a Cedar Point user must never reach). */
const vale: Record<Kind, Rec[]> = { study: [], analysis: [], release: [], due: [], user: [], analyte: [], instrument: [], upload: [] };
/** Cedar Point's own records, for the other parameter of a two-id route. */
const cedar = {} as Record<'study' | 'release' | 'upload', Rec>;
const cedarUser = {} as Record<Role, Session>;

const q = async <T = Record<string, unknown>>(text: string, params: unknown[] = []) => (await h.database.pool.query(text, params)).rows as T[];

/**
 * Every row of Vale Harbor in every table that holds a laboratory's data, as one digest per table
 * (rows reached through their study or user where the table has no laboratory column).
 */
async function valeDigest(): Promise<Record<string, string>> {
  const own = ['laboratory_versions', 'users', 'analytes', 'instruments', 'studies', 'uploads', 'releases', 'release_studies', 'release_waivers', 'release_signatures',
    'release_templates', 'due_items', 'due_reminders', 'audit_events', 'audit_chain_heads', 'audit_checkpoints', 'mail_outbox'];
  const parts = [
    ...own.map((t) => `select '${t}' as t, count(*)::text || ':' || md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as d from ${t} x where x.laboratory_id = $1`),
    ...['specimens', 'analyses', 'signatures'].map((t) => `select '${t}', count(*)::text || ':' || md5(coalesce(string_agg(x::text, '|' order by x::text), '')) from ${t} x where x.study_id in (select id from studies where laboratory_id = $1)`),
    `select 'password_links', count(*)::text || ':' || md5(coalesce(string_agg(x::text, '|' order by x::text), '')) from password_links x where x.user_id in (select id from users where laboratory_id = $1)`,
    `select 'laboratories', md5(x::text) from laboratories x where x.id = $1`,
  ];
  const rows = await q<{ t: string; d: string }>(parts.join(' union all '), [labA]);
  return Object.fromEntries(rows.map((r) => [r.t, r.d]));
}
const valeVersion = async () => (await q<{ v: string }>('select version::text as v from laboratory_versions where laboratory_id = $1', [labA]))[0]?.v ?? '0';

beforeAll(async () => {
  [labA, labB] = await Promise.all(DEMO_LABS.map(async (l) => (await q<{ id: number }>('select id from laboratories where name = $1', [l.name]))[0].id));

  // Vale Harbor: an upload of its own (the seed has none), on a draft study made for it.
  const valeTech = await signedIn(h, 'tech@valeharbor.example');
  const uploadStudy = await createComparison(h, valeTech, 'Isolation: study with an upload');
  const uploaded = await valeTech.agent.post(`/api/v1/studies/${uploadStudy.id}/uploads`).set('X-XSRF-TOKEN', valeTech.xsrf).attach('file', CSV, 'pairs.csv');
  expect(uploaded.status).toBe(201);
  vale.upload.push({ id: uploaded.body.uploadId });

  vale.study = await q<Rec>('select id, version from studies where laboratory_id = $1 order by id', [labA]);
  // Vale Harbor's own answers of the cached reads are in the read cache before Cedar Point asks for the same addresses.
  for (const s of vale.study) {
    for (const path of [`/studies/${s.id}`, `/studies/${s.id}/history`]) expect((await valeTech.agent.get(`/api/v1${path}`)).status).toBe(200);
  }
  vale.study = await q<Rec>('select id, version from studies where laboratory_id = $1 order by id', [labA]);
  vale.analysis = await q<Rec>('select a.id from analyses a join studies s on s.id = a.study_id where s.laboratory_id = $1 and a.state in ($2, $3) order by a.id', [labA, 'done', 'failed']);
  vale.release = (await q<Rec & { requirements: { key: string }[] }>('select id, version, requirements from releases where laboratory_id = $1 order by id', [labA]))
    .map((r) => ({ id: r.id, version: r.version, requirement: r.requirements[0]?.key ?? 'none' }));
  vale.due = await q<Rec>('select id, version from due_items where laboratory_id = $1 order by id', [labA]);
  vale.user = await q<Rec>('select id from users where laboratory_id = $1 order by id', [labA]);
  vale.analyte = await q<Rec>('select id from analytes where laboratory_id = $1 order by id', [labA]);
  vale.instrument = await q<Rec>('select id from instruments where laboratory_id = $1 order by id', [labA]);

  // Cedar Point: a user of every role (the seed has no quality officer there), and a study, release and upload of its own.
  const quality = `quality.isolation.${Date.now().toString(36)}@cedarpoint.example`;
  await h.database.db.insert(users).values({ laboratoryId: labB, name: 'Marta Isolation', email: quality, roles: ['quality'], passwordHash: await hashPassword(DEMO_PASSWORD) });
  const emails: Record<Role, string> = { technologist: 'tech@cedarpoint.example', director: 'director@cedarpoint.example', quality, admin: 'admin@cedarpoint.example' };
  for (const role of ROLES) cedarUser[role] = await signedIn(h, emails[role]);
  const [glucose] = await q<{ id: number }>('select id from analytes where laboratory_id = $1 order by id limit 1', [labB]);
  const instruments = await q<{ id: number }>('select id from instruments where laboratory_id = $1 order by id', [labB]);
  const study = await apiPost(cedarUser.technologist, '/studies', {
    kind: 'method-comparison', title: 'Isolation: Cedar Point study', analyteId: glucose.id, comparativeInstrumentId: instruments[0].id, candidateInstrumentId: instruments[1].id,
  });
  expect(study.status).toBe(201);
  cedar.study = { id: study.body.id, version: study.body.version };
  const release = await apiPost(cedarUser.technologist, '/releases', { changeType: 'reagent-lot', title: 'Isolation: Cedar Point release', analyteId: glucose.id, instrumentId: instruments[1].id });
  expect(release.status).toBe(201);
  cedar.release = { id: release.body.id, version: release.body.version, requirement: release.body.requirements?.[0]?.key };
  const upload = await cedarUser.technologist.agent.post(`/api/v1/studies/${cedar.study.id}/uploads`).set('X-XSRF-TOKEN', cedarUser.technologist.xsrf).attach('file', CSV, 'pairs.csv');
  expect(upload.status).toBe(201);
  cedar.upload = { id: upload.body.uploadId };
});

interface Case { path: string; ids: Ids }

/** Every combination of a Vale Harbor record or a Cedar Point one for each parameter, with at least one Vale Harbor record. */
function cases(route: RouteSpec): Case[] {
  let combos: { ids: Ids; foreign: boolean; path: string }[] = [{ ids: {}, foreign: false, path: route.path }];
  for (const param of paramsOf(route.path)) {
    const kind = kindOf(route.path, param)!;
    const choices: { rec: Rec; foreign: boolean }[] = [
      ...vale[kind].map((rec) => ({ rec, foreign: true })),
      ...(kind in cedar ? [{ rec: cedar[kind as keyof typeof cedar], foreign: false }] : []),
    ];
    combos = combos.flatMap((c) => choices.map((choice) => ({
      ids: { ...c.ids, [kind]: choice.rec }, foreign: c.foreign || choice.foreign, path: c.path.replace(`:${param}`, String(choice.rec.id)),
    })));
  }
  return combos.filter((c) => c.foreign).map(({ path, ids }) => ({ path, ids }));
}

const withId = () => h.routes.filter((r) => paramsOf(r.path).length > 0);

it('knows what every id parameter of the route table names, or why it is not a laboratory\'s record', () => {
  const unknown = withId().filter((r) => !NOT_LABORATORY_OWNED[key(r)] && paramsOf(r.path).some((p) => !kindOf(r.path, p)));
  expect(unknown.map(key)).toEqual([]);
  expect(Object.keys(NOT_LABORATORY_OWNED).filter((k) => !h.routes.some((r) => key(r) === k))).toEqual([]);
  expect(Object.entries(vale).filter(([, recs]) => recs.length === 0).map(([kind]) => kind)).toEqual([]);
  // A study of every kind and of every state is walked.
  return q<{ kind: string; state: string }>('select distinct kind, state from studies where laboratory_id = $1', [labA]).then((rows) => {
    expect(new Set(rows.map((r) => r.kind)).size).toBe(5);
    expect([...new Set(rows.map((r) => r.state))]).toEqual(expect.arrayContaining(['draft', 'awaiting-signoff', 'signed']));
  });
});

it('answers 404 to another laboratory on every route with an id, in every role the route allows, and changes nothing', async () => {
  const before = await valeDigest();
  let version = await valeVersion();
  const wrong: string[] = [];
  let calls = 0;
  const walked = withId().filter((r) => !NOT_LABORATORY_OWNED[key(r)] && r.access !== 'public');
  for (const route of walked) {
    const roles = route.access === 'signed-in' ? ROLES : ROLES.filter((role) => (route.access as readonly Role[]).includes(role));
    for (const { path, ids } of cases(route)) {
      for (const role of roles) {
        const s = cedarUser[role];
        let req = (s.agent as unknown as Record<string, (p: string) => import('supertest').Test>)[route.method](`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).timeout(15_000);
        req = key(route) === 'POST /studies/:id/uploads' ? req.attach('file', CSV, 'pairs.csv') : req.send(BODY[key(route)]?.(ids) ?? {});
        const res = await req.catch((err: Error) => ({ status: `no answer (${err.message})`, body: {} }));
        calls++;
        if (res.status !== 404) wrong.push(`${route.method.toUpperCase()} ${path} as Cedar Point ${role}: ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`);
        const now = await valeVersion();
        if (now !== version) wrong.push(`${route.method.toUpperCase()} ${path} as Cedar Point ${role} changed Vale Harbor's data`);
        version = now;
      }
    }
  }
  expect(wrong).toEqual([]);
  expect(await valeDigest()).toEqual(before);
  // Every route with a laboratory's id was walked, many times over.
  expect(walked.length).toBeGreaterThanOrEqual(39);
  expect(calls).toBeGreaterThan(600);
}, 600_000);

it('refuses the ids of another laboratory\'s records given in a body, naming the field, and creates or changes nothing', async () => {
  const before = await valeDigest();
  const cedarCounts = () => q<{ n: string }>(`select (select count(*) from studies where laboratory_id = $1) || '/' || (select count(*) from releases where laboratory_id = $1)
    || '/' || (select count(*) from release_studies where laboratory_id = $1) || '/' || (select md5(string_agg(x::text, '|' order by x.id)) from studies x where x.laboratory_id = $1) as n`, [labB]);
  const cedarBefore = await cedarCounts();
  const [cedarAnalyte] = await q<{ id: number }>('select id from analytes where laboratory_id = $1 order by id limit 1', [labB]);
  const cedarInstruments = await q<{ id: number }>('select id from instruments where laboratory_id = $1 order by id', [labB]);
  const [valeAnalyte, valeInstrument, valeStudy, valeDue] = [vale.analyte[0].id, vale.instrument[0].id, vale.study[0].id, vale.due[0].id];
  const study = { kind: 'method-comparison', title: 'Isolation: body ids', analyteId: cedarAnalyte.id, comparativeInstrumentId: cedarInstruments[0].id, candidateInstrumentId: cedarInstruments[1].id };
  const release = { changeType: 'reagent-lot', title: 'Isolation: body ids', analyteId: cedarAnalyte.id, instrumentId: cedarInstruments[1].id };
  const tech = cedarUser.technologist;
  const cases: { what: string; field: string; send: () => Promise<{ status: number; body: { issues?: { path: string }[] } }> }[] = [
    { what: 'a new study of another laboratory\'s analyte', field: 'analyteId', send: () => apiPost(tech, '/studies', { ...study, analyteId: valeAnalyte }) },
    { what: 'a new study on another laboratory\'s instrument', field: 'candidateInstrumentId', send: () => apiPost(tech, '/studies', { ...study, candidateInstrumentId: valeInstrument }) },
    { what: 'a study moved to another laboratory\'s analyte', field: 'analyteId', send: async () => {
      const [own] = await q<{ version: number }>('select version from studies where id = $1', [cedar.study.id]);
      return tech.agent.patch(`/api/v1/studies/${cedar.study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: own.version, analyteId: valeAnalyte });
    } },
    { what: 'a new release of another laboratory\'s analyte', field: 'analyteId', send: () => apiPost(tech, '/releases', { ...release, analyteId: valeAnalyte }) },
    { what: 'a new release on another laboratory\'s instrument', field: 'instrumentId', send: () => apiPost(tech, '/releases', { ...release, instrumentId: valeInstrument }) },
    { what: 'a new release compared against another laboratory\'s instrument', field: 'comparativeInstrumentId', send: () => apiPost(tech, '/releases', { ...release, comparativeInstrumentId: valeInstrument }) },
    { what: 'a new release answering another laboratory\'s due item', field: 'dueItemId', send: () => apiPost(tech, '/releases', { ...release, dueItemId: valeDue }) },
    { what: 'another laboratory\'s study linked to an own release', field: 'studyId', send: () => apiPost(tech, `/releases/${cedar.release.id}/studies`, { requirement: cedar.release.requirement, studyId: valeStudy }) },
  ];
  const wrong: string[] = [];
  for (const c of cases) {
    const res = await c.send();
    const namesField = res.status === 400 && (res.body.issues ?? []).some((i) => i.path === c.field);
    if (!(namesField || res.status === 404)) wrong.push(`${c.what}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
  }
  expect(wrong).toEqual([]);
  expect(await cedarCounts()).toEqual(cedarBefore);
  expect(await valeDigest()).toEqual(before);
});
