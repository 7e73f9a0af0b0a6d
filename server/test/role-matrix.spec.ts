import { ROLES, type Role } from '@shared/schemas';
import { DEMO_PASSWORD } from '../db/seed-data';
import type { RouteSpec } from '../http/routes';
import { inventedPairs } from './fixtures';
import { anonymous, freshDatabase, Harness, Session, signedIn, startHarness } from './harness';

/**
 * The role matrix, checked against the POLICY and not against the routes' own `access` fields: every route of
 * the table createApp mounts is listed below under the row of the architecture's roles table
 * (/work/shared/design/ARCHITECTURE.md, "Roles") that governs it. Each demo role then calls every route with
 * real ids of its own laboratory, so an allowed call reaches the handler: it must not answer 401, 403 or 404,
 * and a 400 counts only when it is the body check naming a field (the walk sends `{}`). A role the policy does
 * not allow must answer 403. A route missing from the list fails the test.
 *
 * The walk changes records (it submits, queues, unlinks), so it runs on a database of its own.
 */
let h: Harness;
let drop: () => Promise<void>;
beforeAll(async () => {
  const fresh = await freshDatabase('rolematrix');
  drop = fresh.drop;
  h = await startHarness({}, { jobs: 'send-only', databaseUrl: fresh.url });
}, 120_000);
afterAll(async () => {
  await h?.close();
  await drop?.();
});

const T = 'technologist', D = 'director', Q = 'quality', A = 'admin';

/** The architecture's roles table, row by row, as written there. */
const ARCHITECTURE = {
  drafts: { row: 'create, edit, submit own-lab drafts', roles: [T, D] },
  signStudy: { row: 'sign or return a study', roles: [D] },
  read: { row: 'read every study, findings, PDF and history of the lab', roles: [T, D, Q] },
  audit: { row: 'archive search, integrity re-check, exports', roles: [D, Q] },
  catalog: { row: 'read the analyte and instrument catalog', roles: [T, D, Q, A] },
  releases: { row: 'create a release, link studies', roles: [T, D] },
  releaseDecisions: { row: 'waive a requirement, sign a release', roles: [D] },
  templates: { row: 'release templates and re-verification rules', roles: [A] },
  admin: { row: 'manage users, analytes, instruments; read the mailbox', roles: [A] },
} as const satisfies Record<string, { row: string; roles: readonly Role[] }>;
type Row = keyof typeof ARCHITECTURE;

/**
 * Every route and the row that governs it. `public` needs no sign-in; `own-session` is a signed-in user's own
 * session, whatever the role. Where the table has no row for a route the nearest one is used and the reason is
 * given beside it.
 */
const POLICY: Record<string, Row | 'public' | 'own-session'> = {
  'GET /health': 'public',
  'GET /session': 'public',
  'POST /session': 'public',
  'POST /password-resets': 'public',
  'GET /password-links/:token': 'public',
  'POST /password-links/:token': 'public',
  'DELETE /session': 'own-session',
  'PUT /session/password': 'own-session',

  // Not a row of its own: the laboratory's name, time zone and sign-off setting are read by every page that
  // writes a time (one clock), like the catalog; changing them is the admin's ("an admin setting may relax it").
  'GET /laboratory': 'catalog',
  'PUT /laboratory': 'admin',
  'GET /users': 'admin',
  'POST /users': 'admin',
  'PATCH /users/:id': 'admin',
  'POST /users/:id/unlock': 'admin',
  'POST /users/:id/invitation': 'admin',
  'POST /users/:id/password-link': 'admin',
  'GET /analytes': 'catalog',
  'POST /analytes': 'admin',
  'PUT /analytes/:id': 'admin',
  'GET /instruments': 'catalog',
  'POST /instruments': 'admin',
  'PUT /instruments/:id': 'admin',
  'GET /mailbox': 'admin',

  'GET /worklist': 'read',
  'GET /studies': 'read',
  'POST /studies': 'drafts',
  'GET /studies/:id': 'read',
  'PATCH /studies/:id': 'drafts',
  'GET /studies/:id/specimens': 'read',
  'PUT /studies/:id/specimens': 'drafts',
  'POST /studies/:id/uploads': 'drafts',
  'POST /studies/:id/uploads/:uploadId/import': 'drafts',
  'POST /studies/:id/analyses': 'drafts',
  'GET /analyses/:id': 'read',
  'GET /analyses/:id/events': 'read',
  'GET /studies/:id/plan': 'read',
  'POST /studies/:id/plan-runs': 'drafts',
  'POST /studies/:id/submit': 'drafts',
  'POST /studies/:id/return': 'signStudy',
  'POST /studies/:id/sign': 'signStudy',
  // Approving a plan is the director's signature on it (the architecture: the plan is "covered by plan approval").
  'POST /studies/:id/plan-approval': 'signStudy',
  // An amendment makes a new draft (the architecture's state diagram: signed ──amend──► new draft).
  'POST /studies/:id/amend': 'drafts',
  'GET /studies/:id/signatures': 'read',
  'GET /studies/:id/report.pdf': 'read',
  'GET /studies/:id/history': 'read',
  // The people of the laboratory, offered as filters of the history and archive pages.
  'GET /people': 'read',
  'GET /audit': 'audit',
  'GET /archive': 'audit',
  'GET /archive/export.xlsx': 'audit',
  'GET /studies/:id/export.xlsx': 'audit',
  'POST /studies/:id/integrity-check': 'audit',
  'POST /studies/:id/reproduce': 'audit',
  'POST /audit/chain-check': 'audit',

  // A release is a record of the laboratory like a study: read by whoever reads studies.
  'GET /releases': 'read',
  'GET /releases/export.xlsx': 'audit',
  'POST /releases': 'releases',
  'GET /releases/:id': 'read',
  'PATCH /releases/:id': 'releases',
  'POST /releases/:id/studies': 'releases',
  'DELETE /releases/:id/studies/:studyId': 'releases',
  'POST /releases/:id/waivers': 'releaseDecisions',
  'POST /releases/:id/sign': 'releaseDecisions',
  'GET /releases/:id/report.pdf': 'read',
  'POST /releases/:id/integrity-check': 'audit',
  'GET /releases/:id/history': 'read',
  // Not a row of its own: the templates are read by everyone who creates a release (its requirements come from
  // them) and by the admin who keeps them; read like the catalog. Keeping them is the templates row.
  'GET /release-templates': 'catalog',
  'PUT /release-templates/:changeType': 'templates',
  // The re-verification items due: read with the laboratory's records; moving one's date, with a reason, is a
  // director's decision like a waiver (the rule that sets them due is the templates row); starting one makes a draft.
  'GET /due': 'read',
  'PATCH /due/:id': 'releaseDecisions',
  'POST /due/:id/start': 'drafts',
};

const key = (r: { method: string; path: string }) => `${r.method.toUpperCase()} ${r.path}`;
const expected = (r: RouteSpec): readonly Role[] | 'public' => {
  const p = POLICY[key(r)];
  return p === 'public' ? 'public' : p === 'own-session' ? ROLES : ARCHITECTURE[p].roles;
};

const USER_OF: Record<Role, string> = {
  technologist: 'tech@valeharbor.example',
  director: 'director@valeharbor.example',
  quality: 'quality@valeharbor.example',
  admin: 'admin@valeharbor.example',
};

const q = async <R = Record<string, unknown>>(text: string, params: unknown[] = []) => (await h.database.pool.query(text, params)).rows as R[];

/** Real ids of Vale Harbor's records, so that an allowed call gets past the lookup of its id. */
const ids: Record<string, string> = {};
const CSV = Buffer.from('Specimen,Current,New\nS001,5.1,5.2\nS002,6.3,6.2\nS003,7.4,7.6\n');
let openRelease: { id: number; requirement: string; studyId: number };

beforeAll(async () => {
  const [lab] = await q<{ id: number }>(`select id from laboratories where name = 'Vale Harbor Regional Laboratory'`);
  const one = async (text: string) => String((await q<{ id: number }>(text, [lab.id]))[0].id);
  ids.study = await one(`select id from studies where laboratory_id = $1 and kind = 'method-comparison' and state = 'draft' order by id limit 1`);
  ids.analysis = await one(`select a.id from analyses a join studies s on s.id = a.study_id where s.laboratory_id = $1 and a.state = 'done' order by a.id limit 1`);
  ids.release = await one(`select id from releases where laboratory_id = $1 and state = 'released' order by id limit 1`);
  ids.due = await one(`select id from due_items where laboratory_id = $1 order by id limit 1`);
  ids.user = await one(`select id from users where laboratory_id = $1 and email = 'quality@valeharbor.example'`);
  ids.analyte = await one(`select id from analytes where laboratory_id = $1 order by id limit 1`);
  ids.instrument = await one(`select id from instruments where laboratory_id = $1 order by id limit 1`);
  const tech = await signedIn(h, USER_OF.technologist);
  // An open release, and a draft comparison of its analyte and instrument to link to it and unlink.
  const [open] = await q<{ id: number; requirements: { key: string }[]; analyte_id: number; instrument_id: number }>(
    `select id, requirements, analyte_id, instrument_id from releases where laboratory_id = $1 and state = 'open' order by id limit 1`, [lab.id]);
  const [other] = await q<{ id: number }>('select id from instruments where laboratory_id = $1 and id <> $2 order by id limit 1', [lab.id, open.instrument_id]);
  const linkable = await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf).send({
    kind: 'method-comparison', title: 'Role matrix: study to link', analyteId: open.analyte_id, comparativeInstrumentId: other.id, candidateInstrumentId: open.instrument_id,
  });
  expect(linkable.status).toBe(201);
  openRelease = { id: open.id, requirement: open.requirements[0].key, studyId: linkable.body.id };
  const upload = await tech.agent.post(`/api/v1/studies/${ids.study}/uploads`).set('X-XSRF-TOKEN', tech.xsrf).attach('file', CSV, 'pairs.csv');
  expect(upload.status).toBe(201);
  ids.upload = String(upload.body.uploadId);
  // Rows, so that queuing its analysis is not refused for want of them.
  const [draft] = await q<{ version: number }>('select version from studies where id = $1', [Number(ids.study)]);
  const rows = await tech.agent.put(`/api/v1/studies/${ids.study}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: draft.version, rows: inventedPairs(20) });
  expect(rows.status).toBe(200);
  // Submitting is walked on a study already submitted (a 409 from the handler): the draft has no findings, as no analysis runs here.
  ids.submitted = await one(`select id from studies where laboratory_id = $1 and state = 'awaiting-signoff' order by id limit 1`);
});

/** The path with real ids; a route may prepare its record first (the unlink route needs a link to remove each time). */
async function concrete(route: RouteSpec, prepare = true): Promise<string> {
  const linked = async () => (await q('select 1 from release_studies where release_id = $1 and study_id = $2', [openRelease.id, openRelease.studyId])).length > 0;
  if (key(route) === 'DELETE /releases/:id/studies/:studyId' && prepare && !(await linked())) {
    const director = await signedIn(h, USER_OF.director);
    const res = await director.agent.post(`/api/v1/releases/${openRelease.id}/studies`).set('X-XSRF-TOKEN', director.xsrf)
      .send({ requirement: openRelease.requirement, studyId: openRelease.studyId });
    if (res.status !== 200) throw new Error(`linking a study to unlink answered ${res.status}: ${JSON.stringify(res.body)}`);
  }
  if (key(route) === 'DELETE /releases/:id/studies/:studyId') return `/releases/${openRelease.id}/studies/${openRelease.studyId}`;
  if (key(route) === 'POST /studies/:id/submit') return `/studies/${ids.submitted}/submit`;
  const segment = route.path.split('/')[1];
  const ofSegment: Record<string, string> = { studies: 'study', analyses: 'analysis', releases: 'release', due: 'due', users: 'user', analytes: 'analyte', instruments: 'instrument' };
  return route.path
    .replace(/:id\b/, () => ids[ofSegment[segment]] ?? 'unknown-id')
    .replace(/:uploadId\b/, ids.upload ?? 'unknown-id')
    .replace(/:changeType\b/, 'custom')
    .replace(/:token\b/, 'x'.repeat(30));
}

type Answer = { status: number; body: { error?: string; issues?: { path: string }[] } };
const call = (s: Session, method: string, path: string): Promise<Answer> =>
  (s.agent as unknown as Record<string, (p: string) => import('supertest').Test>)[method](`/api/v1${path}`)
    .set('X-XSRF-TOKEN', s.xsrf).timeout(30_000).send({}) as unknown as Promise<Answer>;

/**
 * A 400 that is the body's check naming a field (the walk sends `{}`): parseRequest's "Invalid body: <field>: ..."
 * or, for the multipart upload, the missing "file" field. Not a refused id or parameter, nor a refusal of the service.
 */
function bodyCheck(route: RouteSpec, res: Answer): boolean {
  if (res.status !== 400) return false;
  const params = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
  const issues = res.body.issues ?? [];
  const named = issues.length > 0 && issues.every((i) => i.path !== '' && i.path !== 'params' && !params.includes(i.path));
  const multipartFile = key(route) === 'POST /studies/:id/uploads' && issues.every((i) => i.path === 'file');
  return named && (/^Invalid body: /.test(res.body.error ?? '') || multipartFile);
}

it('lists every route of the route table under a row of the architecture\'s roles table, and no route that is gone', () => {
  expect(h.routes.length).toBeGreaterThan(60);
  expect(h.routes.filter((r) => !(key(r) in POLICY)).map(key)).toEqual([]);
  expect(Object.keys(POLICY).filter((k) => !h.routes.some((r) => key(r) === k))).toEqual([]);
});

it('declares on each route exactly the roles the policy gives it', () => {
  const declared = (r: RouteSpec) => (r.access === 'public' ? 'public' : r.access === 'signed-in' ? [...ROLES].sort() : [...r.access].sort());
  const policy = (r: RouteSpec) => { const e = expected(r); return e === 'public' ? 'public' : [...e].sort(); };
  const differ = h.routes.filter((r) => JSON.stringify(declared(r)) !== JSON.stringify(policy(r)))
    .map((r) => `${key(r)}: declares ${JSON.stringify(declared(r))}, the policy says ${JSON.stringify(policy(r))}`);
  expect(differ).toEqual([]);
});

describe.each(ROLES)('as %s', (role) => {
  it('reaches the handler of exactly the routes the policy allows it, with its own laboratory\'s ids, and is refused the rest with 403', async () => {
    const wrong: string[] = [];
    let session = await signedIn(h, USER_OF[role], DEMO_PASSWORD);
    for (const route of h.routes) {
      const policy = expected(route);
      if (policy === 'public') continue;
      const allowed = policy.includes(role);
      const path = await concrete(route);
      const res = await call(session, route.method, path);
      const ok = allowed
        ? res.status < 500 && ![401, 403, 404].includes(res.status) && (res.status !== 400 || bodyCheck(route, res))
        : res.status === 403;
      if (!ok) wrong.push(`${route.method.toUpperCase()} ${path}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)} (${allowed ? 'allowed' : 'not allowed'})`);
      if (key(route) === 'DELETE /session') session = await signedIn(h, USER_OF[role], DEMO_PASSWORD);
    }
    expect(wrong).toEqual([]);
  }, 300_000);
});

it('lets the quality role change nothing: every mutating route it may call only re-checks', () => {
  const mutating = h.routes.filter((r) => r.method !== 'get' && !r.readOnly && r.access !== 'public' && r.access !== 'signed-in');
  expect(mutating.filter((r) => (r.access as readonly string[]).includes('quality')).map((r) => `${r.method} ${r.path}`)).toEqual([]);
  expect(h.routes.filter((r) => r.readOnly).map((r) => r.path)).toEqual(['/studies/:id/integrity-check', '/studies/:id/reproduce', '/audit/chain-check', '/releases/:id/integrity-check']);
});

it('answers 401 to a signed-out caller on every route that is not public, and no public route asks for a sign-in', async () => {
  const wrong: string[] = [];
  for (const route of h.routes) {
    const s = await anonymous(h);
    const res = await call(s, route.method, await concrete(route, false));
    const isPublic = expected(route) === 'public';
    // GET /session is public and says "not signed in" with a 401 (the architecture's API outline).
    const publicRefuses = key(route) === 'GET /session' ? res.status !== 401 : [401, 403].includes(res.status);
    if (isPublic ? publicRefuses : res.status !== 401) wrong.push(`${key(route)}: ${res.status}${isPublic ? ' (public)' : ''}`);
  }
  expect(wrong).toEqual([]);
});
