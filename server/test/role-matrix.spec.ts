import { ROLES, type Role } from '@shared/schemas';
import { anonymous, Harness, signedIn, startHarness } from './harness';

/**
 * Walks every API route that exists (the list createApp mounts) with every demo role:
 * a role the route does not allow answers 403, an allowed one never does, and a signed-out
 * caller answers 401 on everything that is not public.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

const USER_OF: Record<Role, string> = {
  technologist: 'tech@valeharbor.example',
  director: 'director@valeharbor.example',
  quality: 'quality@valeharbor.example',
  admin: 'admin@valeharbor.example',
};
const concrete = (path: string) => path.replace(/:id\b/g, '999999').replace(/:(\w*[iI]d)\b/g, '999999').replace(/:token\b/g, 'x'.repeat(30)).replace(/:changeType\b/g, 'custom');

const call = (agent: Awaited<ReturnType<typeof anonymous>>['agent'], xsrf: string, method: string, path: string) =>
  (agent as unknown as Record<string, (p: string) => { set: (k: string, v: string) => { send: (b: object) => Promise<{ status: number }> } }>)[method](`/api/v1${concrete(path)}`)
    .set('X-XSRF-TOKEN', xsrf)
    .send({});

it('has routes to walk', () => {
  expect(h.routes.length).toBeGreaterThan(10);
});

describe.each(ROLES)('as %s', (role) => {
  it('is refused exactly the routes its role does not allow', async () => {
    const outcomes: string[] = [];
    for (const route of h.routes) {
      if (route.access === 'public') continue;
      const s = await signedIn(h, USER_OF[role]);
      const res = await call(s.agent, s.xsrf, route.method, route.path);
      const allowed = route.access === 'signed-in' || route.access.includes(role);
      const ok = allowed ? res.status !== 403 && res.status !== 401 : res.status === 403;
      if (!ok) outcomes.push(`${route.method.toUpperCase()} ${route.path}: ${res.status} (${allowed ? 'allowed' : 'not allowed'})`);
    }
    expect(outcomes).toEqual([]);
  });
});

it('lets the quality role change nothing: every mutating route it may call only re-checks', () => {
  const mutating = h.routes.filter((r) => r.method !== 'get' && !r.readOnly && r.access !== 'public' && r.access !== 'signed-in');
  expect(mutating.filter((r) => (r.access as readonly string[]).includes('quality')).map((r) => `${r.method} ${r.path}`)).toEqual([]);
  expect(h.routes.filter((r) => r.readOnly).map((r) => r.path)).toEqual(['/studies/:id/integrity-check', '/studies/:id/reproduce', '/audit/chain-check', '/releases/:id/integrity-check']);
});

it('answers 401 to a signed-out caller on every route that is not public', async () => {
  const wrong: string[] = [];
  for (const route of h.routes.filter((r) => r.access !== 'public')) {
    const s = await anonymous(h);
    const res = await call(s.agent, s.xsrf, route.method, route.path);
    if (res.status !== 401) wrong.push(`${route.method.toUpperCase()} ${route.path}: ${res.status}`);
  }
  expect(wrong).toEqual([]);
});
