import { createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';
import { AnalysisJobs, jobTiming } from './analysis-jobs';

/**
 * Findings a moment after the click: the worker hears of a new job by NOTIFY rather than at its next poll,
 * and the page hears of progress and the end pushed as server-sent events (GET /api/v1/analyses/:id/events).
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
interface Pushed { id: number; state: string; progress: number }

/** Reads a whole event stream (it ends by itself when the analysis ends) and parses its "state" events. */
async function stream(s: Session, id: number): Promise<{ status: number; type: string; events: Pushed[]; text: string }> {
  const res = await s.agent.get(`/api/v1/analyses/${id}/events`).buffer(true)
    .parse((r, done) => {
      let text = '';
      r.setEncoding('utf8');
      r.on('data', (c: string) => { text += c; });
      r.on('end', () => done(null, text));
    });
  const text = res.status === 200 ? (res.body as string) : '';
  const events = text.split('\n\n').filter((block) => block.startsWith('event: state'))
    .map((block) => JSON.parse(block.split('\n').find((l) => l.startsWith('data: '))!.slice(6)) as Pushed);
  return { status: res.status, type: String(res.headers['content-type'] ?? ''), events, text };
}

async function studyWithRows(s: Session, title: string, n = 40, settings: object = {}) {
  const study = await createComparison(h, s, title, settings);
  await s.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', s.xsrf).send({ version: study.version, rows: inventedPairs(n) }).expect(200);
  return study;
}

const queue = async (s: Session, studyId: number): Promise<number> =>
  (await s.agent.post(`/api/v1/studies/${studyId}/analyses`).set('X-XSRF-TOKEN', s.xsrf).expect(202)).body.id;

it('pushes the state of a running analysis until it is done, then ends the stream', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await studyWithRows(tech, 'Pushed progress', 300, { resamples: 20000, regressionResamples: 5000 });
  const id = await queue(tech, study.id);
  const { status, type, events, text } = await stream(tech, id);
  expect(status).toBe(200);
  expect(type).toMatch(/^text\/event-stream/);
  expect(text.startsWith('retry: 2000')).toBe(true);
  expect(events.length).toBeGreaterThanOrEqual(2);
  expect(events.every((e) => e.id === id)).toBe(true);
  expect(['queued', 'running']).toContain(events[0].state);
  expect(events.at(-1)).toEqual({ id, state: 'done', progress: 1 });
  const progress = events.filter((e) => e.state === 'running').map((e) => e.progress);
  expect(progress).toEqual([...progress].sort((a, b) => a - b));
  const done = (await tech.agent.get(`/api/v1/analyses/${id}`).expect(200)).body;
  expect(done.state).toBe('done');
  expect(done.results.n).toBe(300);
});

it('answers one event and ends at once for an analysis that has ended', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const id = await queue(tech, (await studyWithRows(tech, 'Already done')).id);
  await stream(tech, id);
  const again = await stream(tech, id);
  expect(again.events).toEqual([{ id, state: 'done', progress: 1 }]);
});

it('streams nothing of an analysis that does not exist or belongs to no study of the caller', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  expect((await stream(tech, 999999)).status).toBe(404);
});

it('answers 503 with Retry-After while the process has no notification connection, so the page polls', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const id = await queue(tech, (await studyWithRows(tech, 'No notifications')).id);
  await h.ctx.jobs.events.stop();
  try {
    const res = await tech.agent.get(`/api/v1/analyses/${id}/events`);
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('2');
    expect(res.body.error).toBe("Progress cannot be pushed just now; the page asks for it instead");
  } finally {
    await h.ctx.jobs.events.start();
  }
});

it('wakes a worker in another process by NOTIFY: it asks for the job at once, not at its next poll', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await studyWithRows(tech, 'Woken worker');
  // The API only sends jobs now; a second queue, as another process would have, takes them.
  await h.ctx.jobs.stop();
  await h.ctx.jobs.start({ work: false });
  const worker = new AnalysisJobs(h.database.db, process.env.DATABASE_URL!, jobTiming(30, 1));
  await worker.start({ work: true });
  const boss = (worker as unknown as { boss: { notifyWorker: (id: string) => void } }).boss;
  const woken: string[] = [];
  const original = boss.notifyWorker.bind(boss);
  boss.notifyWorker = (wid: string) => { woken.push(wid); original(wid); };
  try {
    const id = await queue(tech, study.id);
    const { events } = await stream(tech, id);
    expect(events.at(-1)?.state).toBe('done');
    expect(woken.length).toBeGreaterThan(0);
  } finally {
    await worker.stop();
    await h.ctx.jobs.stop();
    await h.ctx.jobs.start({ work: true });
  }
});
