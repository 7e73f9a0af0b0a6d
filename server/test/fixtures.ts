import type { Database } from '../db/client';
import { analytes, instruments } from '../db/schema';

/** What the fixtures need of a harness: its database (a child-process app's test passes its own). */
type WithDb = { database: { db: Database } };

/** The demo glucose analyte and two instruments of the Vale Harbor laboratory. */
export async function catalogIds(h: WithDb) {
  const a = await h.database.db.select().from(analytes);
  const i = await h.database.db.select().from(instruments);
  const glucose = a.find((x) => x.name === 'Glucose' && x.unit === 'mmol/L')!;
  const mine = i.filter((x) => x.laboratoryId === glucose.laboratoryId).sort((p, q) => p.id - q.id);
  return { analyteId: glucose.id, comparativeInstrumentId: mine[0].id, candidateInstrumentId: mine[1].id };
}

type Agent = { agent: import('supertest').Agent; xsrf: string };

export async function createComparison(h: WithDb, s: Agent, title = `Comparison ${Date.now()}`, settings: object = {}) {
  const res = await s.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', s.xsrf)
    .send({ kind: 'method-comparison', title, ...(await catalogIds(h)), settings: { resamples: 1000, regressionResamples: 1000, seed: 'fixture', ...settings } });
  if (res.status !== 201) throw new Error(`create study answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body as { id: number; version: number };
}

/** Invented glucose pairs (mmol/L): a small constant bias with a little noise, deterministic. */
export function inventedPairs(n: number, bias = 0.1): { label: string; comparative: string; candidate: string }[] {
  return Array.from({ length: n }, (_, i) => {
    const x = 3 + (i * 17) / n + ((i * 7) % 5) * 0.1;
    const noise = (((i * 37) % 11) - 5) * 0.02;
    return { label: `S${String(i + 1).padStart(3, '0')}`, comparative: x.toFixed(1), candidate: (x + bias + noise).toFixed(1) };
  });
}

/** Polls an analysis until it is done or failed. */
export async function waitForAnalysis(s: Agent, id: number) {
  for (let i = 0; i < 240; i++) {
    const res = await s.agent.get(`/api/v1/analyses/${id}`);
    if (res.body.state === 'done' || res.body.state === 'failed') return res.body;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`analysis ${id} did not finish`);
}

/** A comparison with 40 rows entered by `s` and current findings (the harness must run jobs). */
export async function analysedComparison(h: WithDb, s: Agent, title?: string) {
  const study = await createComparison(h, s, title);
  await s.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', s.xsrf).send({ version: study.version, rows: inventedPairs(40) });
  const queued = await s.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', s.xsrf);
  const done = await waitForAnalysis(s, queued.body.id);
  if (done.state !== 'done') throw new Error(`fixture analysis failed: ${done.error}`);
  return study;
}
