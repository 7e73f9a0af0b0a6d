import { createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

async function waitFor(agent: Awaited<ReturnType<typeof signedIn>>['agent'], id: number) {
  for (let i = 0; i < 240; i++) {
    const res = await agent.get(`/api/v1/analyses/${id}`).expect(200);
    if (res.body.state === 'done' || res.body.state === 'failed') return res.body;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('the analysis did not finish');
}

describe('analysis jobs', () => {
  it('answers 202, runs the job in a worker thread to findings, and marks them out of date when a row changes', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(40);
    const saved = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(200);
    const queued = await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(202);
    expect(queued.body).toMatchObject({ state: 'queued', seed: 'fixture', resamples: 1000, current: true });
    const done = await waitFor(tech.agent, queued.body.id);
    expect(done.error).toBeNull();
    expect(done.state).toBe('done');
    expect(done.results.n).toBe(40);
    expect(done.results.bias.median.estimate).toBeGreaterThan(0);
    expect(done.results.engine).toMatchObject({ seed: 'fixture', resamples: 1000 });
    expect((await tech.agent.get(`/api/v1/studies/${study.id}`)).body).toMatchObject({ findings: 'current', currentAnalysisId: queued.body.id });

    rows[0].candidate = '19.9';
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: saved.body.version, rows }).expect(200);
    const after = (await tech.agent.get(`/api/v1/studies/${study.id}`)).body;
    expect(after).toMatchObject({ findings: 'out-of-date', currentAnalysisId: null, latestAnalysisId: queued.body.id });
    expect((await tech.agent.get(`/api/v1/analyses/${queued.body.id}`)).body.current).toBe(false);
  });

  it('gives the same results for the same rows, settings and seed', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows: inventedPairs(25) }).expect(200);
    const first = await waitFor(tech.agent, (await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(202)).body.id);
    const second = await waitFor(tech.agent, (await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(202)).body.id);
    expect(first.state).toBe('done');
    expect(second.inputHash).toBe(first.inputHash);
    expect(second.results).toEqual(first.results);
  });

  it('refuses to queue when an included row has an empty result, naming the row', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(5);
    rows[2].candidate = '';
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(200);
    const res = await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(400);
    expect(res.body.error).toBe('row 3: the candidate result is empty; fill it or exclude the row with a reason');
  });
});
