import { eq } from 'drizzle-orm';
import { auditEvents } from '../db/schema';
import { catalogIds } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

describe('studies', () => {
  it('creates a method comparison that brings the analyte\'s unit, decision levels and goal, and audits it', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const ids = await catalogIds(h);
    const res = await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf)
      .send({ kind: 'method-comparison', title: 'Glucose: line 2 against line 1', ...ids }).expect(201);
    expect(res.body.settings).toMatchObject({ unit: 'mmol/L', decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2, resamples: 10000 });
    expect(res.body.settings.seed).toMatch(/^[0-9a-f]{10}$/);
    expect(res.body).toMatchObject({ state: 'draft', version: 1, findings: 'none', n: 0 });
    const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.studyId, res.body.id));
    expect(events.map((e) => e.action)).toEqual(['study.created']);
  });

  it('refuses a bad body naming the field, and the same instrument on both sides', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const ids = await catalogIds(h);
    const bad = await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf).send({ kind: 'method-comparison', title: '', ...ids }).expect(400);
    expect(bad.body.issues[0].path).toBe('title');
    const same = await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf)
      .send({ kind: 'method-comparison', title: 'x', ...ids, candidateInstrumentId: ids.comparativeInstrumentId }).expect(400);
    expect(same.body.issues[0].path).toBe('candidateInstrumentId');
    const settings = await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf)
      .send({ kind: 'method-comparison', title: 'x', ...ids, settings: { resamples: 10 } }).expect(400);
    expect(settings.body.issues[0].path).toBe('settings.resamples');
  });

  it('answers 409 to a stale version and keeps the newer change', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const created = (await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf).send({ kind: 'method-comparison', title: 'Concurrency', ...(await catalogIds(h)) })).body;
    await tech.agent.patch(`/api/v1/studies/${created.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, title: 'First edit' }).expect(200);
    const stale = await tech.agent.patch(`/api/v1/studies/${created.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, title: 'Stale edit' }).expect(409);
    expect(stale.body.issues[0].path).toBe('version');
    const now = await tech.agent.get(`/api/v1/studies/${created.id}`).expect(200);
    expect(now.body).toMatchObject({ title: 'First edit', version: 2 });
  });

  it('lists with server-side filters, sorting and paging, and never another laboratory\'s studies', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const ids = await catalogIds(h);
    const tag = `Paging ${Date.now()}`;
    for (let i = 0; i < 3; i++) await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf).send({ kind: 'method-comparison', title: `${tag} ${i}`, ...ids });
    const page = await tech.agent.get('/api/v1/studies').query({ q: tag, sort: 'title', order: 'asc', pageSize: 2, page: 2 }).expect(200);
    expect(page.body.total).toBe(3);
    expect(page.body.items.map((s: { title: string }) => s.title)).toEqual([`${tag} 2`]);
    const past = await tech.agent.get('/api/v1/studies').query({ q: tag, pageSize: 2, page: 5 }).expect(200);
    expect(past.body).toEqual({ items: [], total: 3 });
    const cedar = await signedIn(h, 'tech@cedarpoint.example');
    const theirs = await cedar.agent.get('/api/v1/studies').query({ q: tag }).expect(200);
    expect(theirs.body.total).toBe(0);
    await cedar.agent.get(`/api/v1/studies/${page.body.items[0].id}`).expect(404);
    await cedar.agent.patch(`/api/v1/studies/${page.body.items[0].id}`).set('X-XSRF-TOKEN', cedar.xsrf).send({ version: 1, title: 'Mine now' }).expect(404);
  });

  it('shows my drafts on the worklist', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const created = (await tech.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', tech.xsrf).send({ kind: 'method-comparison', title: 'Worklist draft', ...(await catalogIds(h)) })).body;
    const list = await tech.agent.get('/api/v1/worklist').expect(200);
    expect(list.body.drafts.map((s: { id: number }) => s.id)).toContain(created.id);
    expect(list.body.awaitingSignature).toEqual([]);
  });
});
