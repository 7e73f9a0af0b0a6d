import { and, desc, eq, isNull } from 'drizzle-orm';
import { planComparison, type ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { analyses, auditEvents, studies, users } from '../db/schema';
import { analysedComparison, createComparison, waitForAnalysis } from '../test/fixtures';
import { apiPatch, apiPost, Harness, signedIn, signedStudy, startHarness, type Session } from '../test/harness';
import { planResultsHash } from './plan-input';

/**
 * A method comparison's plan by simulation through the API: set on Setup (a record-only plan field), run as a job
 * of the analysis queue, read back with its figures and the imprecision a signed precision study found, approved
 * by the director with its figures, and refused with errors that name the Setup field.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const people = async () => ({
  tech: await signedIn(h, 'tech@valeharbor.example'),
  director: await signedIn(h, 'director@valeharbor.example'),
  quality: await signedIn(h, 'quality@valeharbor.example'),
});

/** A small plan that runs in well under a second: Deming, 100 simulated studies at n = 20 and 40. */
const SMALL_PLAN = { errorModel: 'proportional', cvComparative: 2.5, cvCandidate: 3, low: 3, high: 25, shape: 'uniform', n: [40, 20], simulations: 100 };

async function plannedStudy(s: Session, samplePlan: object = SMALL_PLAN, settings: object = {}) {
  const study = await createComparison(h, s, `Planned comparison ${Date.now()}`, { regression: 'deming', seed: 'plan-api', ...settings });
  const saved = await apiPatch(s, `/studies/${study.id}`, { version: study.version, settings: { samplePlan } }).expect(200);
  return { id: study.id as number, version: saved.body.version as number, settings: saved.body.settings };
}

async function runPlan(s: Session, id: number) {
  const queued = (await apiPost(s, `/studies/${id}/plan-runs`).expect(202)).body;
  expect(['queued', 'running', 'done']).toContain(queued.latest.state);
  const done = await waitForAnalysis(s, queued.latest.id);
  expect(done.state).toBe('done');
  return (await s.agent.get(`/api/v1/studies/${id}/plan`).expect(200)).body;
}

describe('a plan by simulation', () => {
  it('runs as a job from the study settings and gives the figures the engine gives, per n and decision level, without touching the findings', async () => {
    const { tech } = await people();
    const study = await plannedStudy(tech);
    expect(study.settings.samplePlan).toMatchObject({ ...SMALL_PLAN, targetPower: 0.8, maxFalsePass: 0.05 });
    const before = (await tech.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body;
    expect(before).toMatchObject({ problems: [], latest: null, current: false });

    const plan = await runPlan(tech, study.id);
    expect(plan.current).toBe(true);
    const results = plan.latest.results as ComparisonPlanResult;
    expect(results.rows.map((r) => r.n)).toEqual([20, 40]);
    expect(results.rows[0].levels.map((l) => l.level)).toEqual(study.settings.decisionLevels);
    // The stored run's input is the engine's plan options; the figures are the engine's for them, bit for bit.
    const [run] = await h.database.db.select().from(analyses).where(eq(analyses.id, plan.latest.id));
    expect(run.purpose).toBe('plan');
    const input = run.input as { kind: string; plan: Parameters<typeof planComparison>[0] };
    expect(input.plan).toMatchObject({ regression: 'deming', seed: 'plan-api', decisionLevels: study.settings.decisionLevels, simulations: 100, cvCandidate: 3 });
    expect(results).toEqual(JSON.parse(JSON.stringify(planComparison(input.plan))));
    for (const row of results.rows) for (const l of row.levels) {
      for (const p of [l.powerAtZero, l.powerAtHalf, l.falsePass]) expect(p).toBeGreaterThanOrEqual(0);
      expect(l.powerAtZero).toBeGreaterThanOrEqual(l.falsePass);
    }

    // A plan run is not findings: the study still has none, and the history says what ran.
    const view = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    expect(view).toMatchObject({ findings: 'none', latestAnalysisId: null });
    const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.studyId, study.id));
    const queued = events.find((e) => e.action === 'plan.queued')!;
    expect(queued.after).toMatchObject({ simulations: 100, n: [20, 40], seed: 'plan-api', regression: 'deming' });
    expect(events.find((e) => e.action === 'analysis.done')!.after).toMatchObject({ purpose: 'plan' });
    const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body;
    const headlines = JSON.stringify(history);
    expect(headlines).toContain('Plan simulation queued (100 simulated studies per n, n = 20, 40; seed plan-api)');
    expect(headlines).toMatch(/Plan simulation finished in [\d,]+ ms/);

    // Changing the plan leaves the run out of date until it runs again.
    await apiPatch(tech, `/studies/${study.id}`, { version: study.version, settings: { samplePlan: { ...SMALL_PLAN, cvCandidate: 4 } } }).expect(200);
    const stale = (await tech.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body;
    expect(stale).toMatchObject({ current: false, latest: { id: plan.latest.id, current: false } });
    const again = await runPlan(tech, study.id);
    expect(again.current).toBe(true);
    const widerError = (again.latest.results as ComparisonPlanResult).rows[1].levels[0];
    expect(widerError.medianHalfWidth!).toBeGreaterThan(results.rows[1].levels[0].medianHalfWidth!);
  });

  it('refuses a plan that cannot run, naming the Setup field, and lets only editors of a draft run it', async () => {
    const { tech, quality } = await people();
    const bare = await createComparison(h, tech, `Unplanned ${Date.now()}`);
    const none = await apiPost(tech, `/studies/${bare.id}/plan-runs`).expect(400);
    expect(none.body.issues[0].path).toBe('settings.samplePlan');

    const bad = await apiPatch(tech, `/studies/${bare.id}`, { version: bare.version, settings: { samplePlan: { ...SMALL_PLAN, high: 2 } } }).expect(400);
    expect(bad.body.issues[0]).toMatchObject({ path: 'settings.samplePlan.high' });
    expect(bad.body.issues[0].message).toMatch(/high end of the range must be above the low end/);
    const grid = await apiPatch(tech, `/studies/${bare.id}`, { version: bare.version, settings: { samplePlan: { ...SMALL_PLAN, n: [40, 3] } } }).expect(400);
    expect(grid.body.issues[0]).toMatchObject({ path: 'settings.samplePlan.n.1' });

    const noLevels = await plannedStudy(tech, SMALL_PLAN, { decisionLevels: [] });
    const refused = await apiPost(tech, `/studies/${noLevels.id}/plan-runs`).expect(400);
    expect(refused.body.issues[0]).toMatchObject({ path: 'settings.decisionLevels' });
    expect(refused.body.error).toMatch(/settings\.decisionLevels: must name at least one decision level/);
    const noGoal = await plannedStudy(tech, SMALL_PLAN, { allowableBiasAbsolute: null, allowableBiasPercent: null });
    expect((await apiPost(tech, `/studies/${noGoal.id}/plan-runs`).expect(400)).body.issues[0].path).toBe('settings.allowableBiasAbsolute');
    // Nothing was queued for the refused plans.
    expect(await h.database.db.select().from(analyses).where(eq(analyses.studyId, noLevels.id))).toEqual([]);

    const study = await plannedStudy(tech);
    await apiPost(quality, `/studies/${study.id}/plan-runs`).expect(403);
    expect((await quality.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body.problems).toEqual([]);
    await apiPost(tech, '/studies/999999/plan-runs').expect(404);
    const signed = await signedStudy(h, `Signed before planning ${Date.now()}`);
    const late = await apiPost(tech, `/studies/${signed}/plan-runs`).expect(409);
    expect(late.body.error).toMatch(/cannot be changed: it is signed/);
  });

  it('answers only for method comparisons', async () => {
    const { tech } = await people();
    const [other] = await h.database.db.select({ id: studies.id }).from(studies).where(eq(studies.kind, 'precision')).limit(1);
    const res = await tech.agent.get(`/api/v1/studies/${other.id}/plan`).expect(400);
    expect(res.body.error).toMatch(/Only a method comparison is planned by simulation/);
  });

  it('draws the range from an earlier comparison\'s comparative values, and names a study that will not do', async () => {
    const { tech } = await people();
    const earlier = await analysedComparison(h, tech, `Earlier glucose comparison ${Date.now()}`);
    const study = await plannedStudy(tech, { ...SMALL_PLAN, shape: 'earlier-study', earlierStudyId: earlier.id });
    const plan = (await tech.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body;
    expect(plan.earlierStudies).toContainEqual({ id: earlier.id, title: expect.stringContaining('Earlier glucose comparison'), n: 40 });
    const done = await runPlan(tech, study.id);
    const [run] = await h.database.db.select().from(analyses).where(eq(analyses.id, done.latest.id));
    const values = (run.input as { plan: { values: number[]; shape: string } }).plan;
    expect(values.shape).toBe('values');
    expect(values.values).toHaveLength(40);

    const wrong = await plannedStudy(tech, { ...SMALL_PLAN, shape: 'earlier-study', earlierStudyId: study.id });
    const refused = await apiPost(tech, `/studies/${wrong.id}/plan-runs`).expect(400);
    expect(refused.body.issues[0].path).toBe('settings.samplePlan.earlierStudyId');
  });

  it('offers the imprecision a signed precision study of the same analyte and instrument found', async () => {
    const { tech } = await people();
    // The demo laboratory's signed precision study gives the analyte and the instrument; the one the plan must offer is
    // the latest signed, not superseded precision study of that pair in the laboratory (other suites may sign more).
    const [{ lab }] = await h.database.db.select({ lab: users.laboratoryId }).from(users).where(eq(users.email, 'tech@valeharbor.example'));
    const signedPrecision = (analyteId?: number, instrumentId?: number | null) => h.database.db.select().from(studies)
      .where(and(eq(studies.laboratoryId, lab), eq(studies.kind, 'precision'), eq(studies.state, 'signed'), isNull(studies.supersededById),
        ...(analyteId ? [eq(studies.analyteId, analyteId)] : []), ...(instrumentId ? [eq(studies.instrumentId, instrumentId)] : [])))
      .orderBy(desc(studies.signedAt)).limit(1);
    const [demo] = await signedPrecision();
    const study = await createComparison(h, tech, `Planned on the precision study's line ${Date.now()}`, { seed: 'plan-api' });
    await h.database.db.update(studies).set({ candidateInstrumentId: demo.instrumentId, analyteId: demo.analyteId }).where(eq(studies.id, study.id));
    const [precision] = await signedPrecision(demo.analyteId, demo.instrumentId);
    const plan = (await tech.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body;
    const found = plan.imprecision.candidate;
    expect(found).toMatchObject({ studyId: precision.id, title: precision.title });
    // One entry per material of that study, in its order (the demo's two controls).
    expect(found.materials.map((m: { name: string }) => m.name)).toEqual((precision.settings as { materials: { name: string }[] }).materials.map((m) => m.name));
    expect(found.cv).toBe(Math.max(...found.materials.map((m: { cv: number }) => m.cv)));
    expect(found.sd).toBe(Math.max(...found.materials.map((m: { sd: number }) => m.sd)));
    for (const m of found.materials) expect(m.cv).toBeCloseTo((100 * m.sd) / m.mean, 8);
  });

  it('is approved with its figures: refused before a current run, then the content hash covers the run; a later change needs a reason', async () => {
    const { tech, director } = await people();
    const study = await plannedStudy(tech);
    const early = await apiPost(director, `/studies/${study.id}/plan-approval`, { password: 'parallax-demo', comment: '' }).expect(409);
    expect(early.body.error).toMatch(/Run the plan .* before approving it/);

    const plan = await runPlan(tech, study.id);
    await apiPost(director, `/studies/${study.id}/plan-approval`, { password: 'parallax-demo', comment: 'Forty specimens will do' }).expect(200);
    const [event] = await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.studyId, study.id), eq(auditEvents.action, 'plan.approved')));
    const approved = (event.after as { plan: { samplePlan: unknown; planRun: { analysisId: number; resultsHash: string; recommendedN: number | null } } }).plan;
    expect(approved.samplePlan).toMatchObject(SMALL_PLAN);
    expect(approved.planRun).toEqual({
      analysisId: plan.latest.id, inputHash: plan.latest.inputHash, resultsHash: planResultsHash(plan.latest.results), recommendedN: plan.latest.results.recommendedN,
    });

    const current = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    const change = { version: current.version, settings: { samplePlan: { ...SMALL_PLAN, simulations: 200 } } };
    const refused = await apiPatch(tech, `/studies/${study.id}`, change).expect(400);
    expect(refused.body.error).toMatch(/The plan was approved; give a reason for changing the plan by simulation/);
    await apiPatch(tech, `/studies/${study.id}`, { ...change, reason: 'More simulated studies for a steadier figure' }).expect(200);
    const [amended] = await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.studyId, study.id), eq(auditEvents.action, 'study.plan-amended')));
    expect(amended.reason).toBe('More simulated studies for a steadier figure');
  });
});
