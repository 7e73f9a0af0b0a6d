import seedrandom from 'seedrandom';
import { kindMeta } from '@shared/kinds/kinds';
import { analytes, instruments } from '../db/schema';
import { precisionRuns } from '../kinds/precision/demo';
import { RANGE_DEMOS } from '../kinds/reportable-range/demo';
import { analysedSettings } from '../specimens/input-hash';
import { catalogIds, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { apiPatch, apiPost, apiPut, Harness, signedIn, startHarness, type Session } from '../test/harness';

/**
 * Record-only settings are words for people (lots, sources, rules, the plan before data), not inputs of the
 * engine (server/specimens/input-hash.ts RECORD_ONLY, and each kind's KindMeta.recordOnly): changing one leaves
 * a study's findings current with no new run, while changing a setting the engine reads makes them out of date.
 * For every kind, every record-only setting is changed in turn on a study with current findings.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Created = { id: number; version: number; settings: Record<string, unknown> };

/** A new value for each record-only setting every study carries. */
const COMMON: Record<string, unknown> = {
  allowableBiasSource: 'Invented goal, memo 4', comparativeLot: 'CMP-1104', candidateLot: 'CND-1205', reagentLot: 'RG-0712',
  runsFrom: '2026-11-02', runsTo: '2026-11-20', plannedSpecimens: 45, outlierRule: 'Reviewed by eye (invented rule)',
  acceptanceRule: 'An invented acceptance rule', populationDescription: 'Invented healthy adults, 18 to 65 years',
  statedSource: 'Invented package insert, edition 6', decimalMark: 'comma',
};

const labOf = async (analyte: string, instrument?: string) => {
  const all = await h.database.db.select().from(instruments);
  const line = instrument ? all.find((i) => i.name === instrument)! : undefined;
  const a = (await h.database.db.select().from(analytes)).find((x) => x.name === analyte && (!line || x.laboratoryId === line.laboratoryId))!;
  return { analyteId: a.id, instrumentId: (line ?? all.find((i) => i.laboratoryId === a.laboratoryId)!).id };
};

/** Invented potassium values (mmol/L) from a seeded generator. */
const potassium = (n: number) => {
  const rng = seedrandom('record-only');
  return Array.from({ length: n }, (_, i) => ({ label: `K${i + 1}`, value: (4.2 + 0.3 * Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng())).toFixed(2), sex: i % 2 ? 'M' : 'F' }));
};

interface KindCase {
  kind: string;
  /** The study's identity and settings at creation, and its rows. */
  create: () => Promise<{ body: object; rows: object[] }>;
  /** New values of the kind's own record-only settings. */
  own: Record<string, unknown>;
  /** A change of a setting the engine reads. */
  analysed: Record<string, unknown>;
}

const CASES: KindCase[] = [
  {
    kind: 'method-comparison',
    create: async () => ({ body: { ...(await catalogIds(h)), settings: { resamples: 1000, regressionResamples: 1000, seed: 'record-only', decisionLevels: [5] } }, rows: inventedPairs(30) }),
    own: { samplePlan: { errorModel: 'proportional', cvComparative: 2.5, cvCandidate: 3, low: 3, high: 25, shape: 'uniform', earlierStudyId: null, n: [40, 20], simulations: 100, targetPower: 0.8, maxFalsePass: 0.05 } },
    analysed: { seed: 'another seed' },
  },
  {
    kind: 'precision',
    create: async () => ({
      body: { ...(await labOf('Glucose', 'Chemistry line 2')), settings: { decimals: 2, materials: [{ name: 'Low', claimRepeatability: 0.08, claimWithinLab: 0.12, claimAs: 'sd' }] } },
      rows: precisionRuns('ro-prec', 'Low', ['1', '2', '3', '4', '5'], 5, 5.42, 0.06, 0.03, 2),
    }),
    own: { controlLot: 'KC-2612' },
    analysed: { alpha: 0.01 },
  },
  {
    kind: 'reportable-range',
    create: async () => ({ body: { ...(await labOf('Glucose', 'Chemistry line 2')), settings: { ...RANGE_DEMOS[0].settings, resamples: 1000 } }, rows: RANGE_DEMOS[0].rows.map((r) => ({ ...r })) }),
    own: { nonlinearitySource: 'Director\'s goal, memo 13 (invented)' },
    analysed: { allowableNonlinearity: 0.7 },
  },
  {
    kind: 'interval-verify',
    create: async () => ({ body: { ...(await labOf('Potassium')), settings: { resamples: 1000, seed: 'record-only', statedLower: 3.5, statedUpper: 5.1, statedSource: 'Invented insert' } }, rows: potassium(20) }),
    own: {},
    analysed: { statedUpper: 5.3 },
  },
  {
    kind: 'interval-establish',
    create: async () => ({ body: { ...(await labOf('Potassium')), settings: { resamples: 1000, seed: 'record-only' } }, rows: potassium(120) }),
    own: {},
    analysed: { confidenceLevel: 0.95 },
  },
];

const studyOf = async (s: Session, id: number) => (await s.agent.get(`/api/v1/studies/${id}`).expect(200)).body;

async function analysedStudy(s: Session, c: KindCase): Promise<Created & { analysisId: number }> {
  const { body, rows } = await c.create();
  const created = (await apiPost(s, '/studies', { kind: c.kind, title: `Record-only ${c.kind} ${Date.now()}`, ...body }).expect(201)).body as Created;
  const saved = (await apiPut(s, `/studies/${created.id}/specimens`, { version: created.version, rows }).expect(200)).body;
  const queued = (await apiPost(s, `/studies/${created.id}/analyses`).expect(202)).body;
  const done = await waitForAnalysis(s, queued.id);
  expect(done).toMatchObject({ state: 'done', error: null });
  return { ...created, version: saved.version, analysisId: queued.id };
}

describe.each(CASES)('record-only settings, $kind', (c) => {
  it('leave its findings current, with no new run, one by one; a setting the engine reads makes them out of date', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedStudy(tech, c);
    expect(await studyOf(tech, study.id)).toMatchObject({ findings: 'current', currentAnalysisId: study.analysisId, latestAnalysisId: study.analysisId });

    // Every setting the analysis does not read has a new value here (a record-only setting added later must be added too).
    const changes = { ...COMMON, ...c.own };
    const settings = (await studyOf(tech, study.id)).settings as Record<string, unknown>;
    const recordOnly = Object.keys(settings).filter((k) => !(k in analysedSettings(settings, c.kind)));
    expect(recordOnly.sort()).toEqual(Object.keys(changes).sort());
    expect(Object.keys(c.own).sort()).toEqual([...(kindMeta(c.kind).recordOnly ?? [])].sort());

    let version = study.version;
    for (const [key, value] of Object.entries(changes)) {
      expect(settings[key]).not.toEqual(value);
      const patched = (await apiPatch(tech, `/studies/${study.id}`, { version, settings: { [key]: value } }).expect(200)).body;
      version = patched.version;
      expect({ key, value: patched.settings[key], findings: patched.findings }).toEqual({ key, value, findings: 'current' });
      expect({ key, ...(await studyOf(tech, study.id)) }).toMatchObject({ key, findings: 'current', currentAnalysisId: study.analysisId, latestAnalysisId: study.analysisId });
    }
    expect((await tech.agent.get(`/api/v1/analyses/${study.analysisId}`).expect(200)).body.current).toBe(true);

    const changed = (await apiPatch(tech, `/studies/${study.id}`, { version, settings: c.analysed }).expect(200)).body;
    expect(changed).toMatchObject({ findings: 'out-of-date', currentAnalysisId: null, latestAnalysisId: study.analysisId });
    expect((await tech.agent.get(`/api/v1/analyses/${study.analysisId}`).expect(200)).body.current).toBe(false);
  });
});
