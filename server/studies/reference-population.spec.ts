import { and, eq } from 'drizzle-orm';
import { analytes, auditEvents, instruments } from '../db/schema';
import { waitForAnalysis } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

/**
 * The reference population of a verification: the form fills it, the report prints it. It is words for
 * people (record-only, specimens/input-hash.ts), so saving it is audited like any setting and leaves the
 * findings current.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const patch = (s: Session, id: number, body: object) => s.agent.patch(`/api/v1/studies/${id}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

async function analysedVerification(s: Session) {
  const potassium = (await h.database.db.select().from(analytes)).find((a) => a.name === 'Potassium')!;
  const instrument = (await h.database.db.select().from(instruments)).find((i) => i.laboratoryId === potassium.laboratoryId)!;
  const created = await s.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', s.xsrf).send({
    kind: 'interval-verify', title: `Population ${Date.now()}`, analyteId: potassium.id, instrumentId: instrument.id,
    settings: { statedLower: 3.5, statedUpper: 5.1, statedSource: 'Manufacturer insert (invented)' },
  }).expect(201);
  const rows = Array.from({ length: 20 }, (_, i) => ({ label: `P${i + 1}`, value: (3.7 + (i % 10) * 0.12).toFixed(2) }));
  const put = await s.agent.put(`/api/v1/studies/${created.body.id}/specimens`).set('X-XSRF-TOKEN', s.xsrf).send({ version: created.body.version, rows }).expect(200);
  const queued = await s.agent.post(`/api/v1/studies/${created.body.id}/analyses`).set('X-XSRF-TOKEN', s.xsrf).expect(202);
  const done = await waitForAnalysis(s, queued.body.id);
  expect(done.state).toBe('done');
  return { id: created.body.id as number, version: put.body.version as number };
}

describe('the reference population of a verification', () => {
  it('saves, is audited with the change in words, and leaves the findings current', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedVerification(tech);
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.findings).toBe('current');

    const words = 'Healthy adult blood donors, 18–65 y (invented)';
    const saved = await patch(tech, study.id, { version: study.version, settings: { populationDescription: words } }).expect(200);
    expect(saved.body.settings.populationDescription).toBe(words);
    const after = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    expect(after.settings.populationDescription).toBe(words);
    expect(after.findings).toBe('current');

    const [event] = await h.database.db.select().from(auditEvents)
      .where(and(eq(auditEvents.studyId, study.id), eq(auditEvents.action, 'study.updated')));
    expect((event.before as { settings: Record<string, unknown> }).settings.populationDescription).toBe('');
    expect((event.after as { settings: Record<string, unknown> }).settings.populationDescription).toBe(words);
    const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body as { headline: string; details: string[] }[];
    expect(history.find((e) => e.headline === 'Setup changed')?.details).toContain(`population description: (empty) → ${words}`);
  });

  it('refuses a description over 2,000 characters naming the field, and saves nothing', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedVerification(tech);
    const res = await patch(tech, study.id, { version: study.version, settings: { populationDescription: 'x'.repeat(2001) } }).expect(400);
    expect(res.body.issues).toEqual([{ path: 'settings.populationDescription', message: 'Keep the description of the reference population to 2,000 characters' }]);
    const after = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    expect([after.version, after.settings.populationDescription]).toEqual([study.version, '']);
  });
});
