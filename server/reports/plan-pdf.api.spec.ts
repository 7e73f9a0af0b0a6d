import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { createComparison, waitForAnalysis } from '../test/fixtures';
import { apiPatch, apiPost, binary, Harness, signedIn, startHarness, type Session } from '../test/harness';
import { flat, pdfPages } from './testing/pdf-text';

/**
 * The study PDF reads the plan by simulation from the database (study-pdf.ts): nothing without a plan, a line
 * saying it has not been run while the plan has no run for its current settings, and the run's figures once it has.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const NOT_RUN = 'A plan by simulation is set, but it has not been run for its current settings, so no sample size is given here.';
/** A plan that runs in well under a second: 100 simulated studies at n = 20 and 40. */
const PLAN = { errorModel: 'proportional', cvComparative: 2.5, cvCandidate: 3, low: 3, high: 25, shape: 'uniform', n: [20, 40], simulations: 100 };
const pct = (v: number): string => `${(100 * v).toFixed(1)}%`;

async function pdfText(s: Session, id: number): Promise<string> {
  const res = await s.agent.get(`/api/v1/studies/${id}/report.pdf`).buffer(true).parse(binary).expect(200);
  return flat(pdfPages(res.body as Buffer));
}

describe('the plan by simulation in the study PDF', () => {
  it('prints nothing without a plan, says an unrun plan is unrun, and prints the current run’s figures', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech, `Planned comparison PDF ${Date.now()}`, {
      seed: 'plan-pdf', decisionLevels: [5, 10], allowableBiasAbsolute: 0.3, allowableBiasPercent: 5,
    });
    const none = await pdfText(tech, study.id);
    expect(none).toContain('Plan and acceptance criteria');
    expect(none).not.toContain('Sample size by simulation');
    expect(none).not.toContain(NOT_RUN);

    const saved = await apiPatch(tech, `/studies/${study.id}`, { version: study.version, settings: { samplePlan: PLAN } }).expect(200);
    expect(await pdfText(tech, study.id)).toContain(`Sample size by simulation ${NOT_RUN}`);

    const queued = (await apiPost(tech, `/studies/${study.id}/plan-runs`).expect(202)).body;
    expect((await waitForAnalysis(tech, queued.latest.id)).state).toBe('done');
    const plan = (await tech.agent.get(`/api/v1/studies/${study.id}/plan`).expect(200)).body;
    const results = plan.latest.results as ComparisonPlanResult;
    const run = await pdfText(tech, study.id);
    expect(run).not.toContain(NOT_RUN);
    expect(run).toContain(`Run Plan run ${plan.latest.id}, finished `);
    expect(run).toContain('Imprecision CV 2.5% for the comparative method and CV 3% for the candidate');
    expect(run).toContain(results.reason);
    for (const row of results.rows) {
      for (const l of row.levels) expect(run).toContain(` ${row.n} ${l.level.toFixed(1)} mmol/L ±${l.allowable.toFixed(2)} mmol/L ${pct(l.powerAtZero)} ${pct(l.powerAtHalf)} ${pct(l.falsePass)}`);
    }

    // A changed plan leaves the run behind: the PDF says so again rather than print figures of other settings.
    await apiPatch(tech, `/studies/${study.id}`, { version: saved.body.version, settings: { samplePlan: { ...PLAN, cvCandidate: 4 } } }).expect(200);
    const stale = await pdfText(tech, study.id);
    expect(stale).toContain(`Sample size by simulation ${NOT_RUN}`);
    expect(stale).not.toContain(results.reason);
  });
});
