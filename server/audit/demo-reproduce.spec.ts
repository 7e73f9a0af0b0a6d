import { and, eq, inArray } from 'drizzle-orm';
import { laboratories, studies } from '../db/schema';
import { DEMO_LABS } from '../db/seed-data';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

const DEMO_TITLES = [
  'Glucose: Chemistry line 2 against line 1', 'Creatinine: Chemistry line 2 against line 1', 'Sodium: Chemistry line 2 against line 1',
  'Creatinine reference interval, adults (Chemistry line 2)', 'Potassium: verify the stated interval (Chemistry line 2)',
  'Thyrotropin: verify the stated interval (Immunoassay 1)',
];

it('re-runs every demo study from its stored seed, resamples and engine version with identical results', async () => {
  const [lab] = await h.database.db.select().from(laboratories).where(eq(laboratories.name, DEMO_LABS[0].name));
  const demo = await h.database.db.select().from(studies).where(and(eq(studies.laboratoryId, lab.id), inArray(studies.title, DEMO_TITLES)));
  expect(demo.map((s) => s.title).sort()).toEqual([...DEMO_TITLES].sort());
  expect(demo.filter((s) => s.state === 'signed').length).toBeGreaterThanOrEqual(2);
  const quality = await signedIn(h, 'quality@valeharbor.example');
  for (const s of demo) {
    const res = await quality.agent.post(`/api/v1/studies/${s.id}/reproduce`).set('X-XSRF-TOKEN', quality.xsrf).expect(200);
    expect({ title: s.title, identical: res.body.identical, differences: res.body.differences }).toEqual({ title: s.title, identical: true, differences: [] });
    if (s.state === 'signed') {
      const check = await quality.agent.post(`/api/v1/studies/${s.id}/integrity-check`).set('X-XSRF-TOKEN', quality.xsrf).expect(200);
      expect(check.body.checks.filter((c: { passed: boolean }) => !c.passed)).toEqual([]);
    }
  }
});
