import seedrandom from 'seedrandom';
import { eq } from 'drizzle-orm';
import type { CreateStudyBody, StudySettingsPatch } from '@shared/schemas';
import { analyseNow } from '../analyses/analyses.service';
import { planNow } from '../plans/plans.service';
import { AnalysisJobs } from '../analyses/analysis-jobs';
import { toSignedIn } from '../auth/auth.service';
import { putRows } from '../specimens/specimens.service';
import { createStudy } from '../studies/studies.service';
import type { AppContext } from '../context';
import { MailService } from '../mail/mail-service';
import { signStudy } from '../signoff/sign.service';
import { submitStudy } from '../signoff/signoff.service';
import { DEMO_PASSWORD } from './seed-data';
import type { Database } from './client';
import { analytes, instruments, studies, users } from './schema';
import { SERVER_KINDS } from '../kinds';
import { seedDemoReleases } from '../releases/demo';
import { systemScope } from './lab-scope';

const gaussian = (rng: () => number) => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());

/** Invented pairs: y = slope·x + offset, with noise proportional to x (CV) and a floor. Deterministic. */
function pairs(seed: string, n: number, lo: number, hi: number, slope: number, offset: number, cv: number, decimals: number) {
  const rng = seedrandom(seed);
  const normal = () => gaussian(rng);
  return Array.from({ length: n }, (_, i) => {
    const truth = lo * Math.pow(hi / lo, rng());
    const x = truth * (1 + cv * normal());
    const y = (slope * truth + offset) * (1 + cv * normal());
    return { label: `VH-${String(1000 + i * 7)}`, comparative: x.toFixed(decimals), candidate: y.toFixed(decimals) };
  });
}

type Finish = 'draft' | 'submitted' | 'signed';
interface DemoComparison { title: string; analyte: string; purpose: string; rows: ReturnType<typeof pairs>; settings: StudySettingsPatch; finish: Finish }

const COMPARISONS: DemoComparison[] = [
  {
    title: 'Glucose: Chemistry line 2 against line 1',
    analyte: 'Glucose',
    purpose: 'Verify the new chemistry line before it reports patient glucose results (invented demo study).',
    rows: pairs('vh-glucose', 60, 2.5, 25, 1.005, 0.02, 0.012, 1),
    settings: { seed: 'vh-glucose-2026', comparativeLot: 'GLU-4471', candidateLot: 'GLU-4502', runsFrom: '2026-11-02', runsTo: '2026-11-09', plannedSpecimens: 60 },
    finish: 'signed',
  },
  {
    title: 'Creatinine: Chemistry line 2 against line 1',
    analyte: 'Creatinine',
    purpose: 'Verify creatinine on the new chemistry line; the candidate reads proportionally high (invented demo study).',
    rows: pairs('vh-creatinine', 80, 40, 900, 1.075, -2, 0.02, 0),
    settings: { seed: 'vh-creatinine-2026', comparativeLot: 'CRE-2210', candidateLot: 'CRE-2264', runsFrom: '2026-11-03', runsTo: '2026-11-12', plannedSpecimens: 80 },
    finish: 'submitted',
  },
  {
    // Reported in whole mmol/L: the CIs of the median bias and of the bias at the decision levels collapse to
    // one value, so the findings show what the reporting step allows.
    title: 'Sodium: Chemistry line 2 against line 1',
    analyte: 'Sodium',
    purpose: 'Verify sodium on the new chemistry line; results are reported in whole mmol/L and the candidate reads about 1 mmol/L high (invented demo study).',
    rows: pairs('vh-sodium', 60, 122, 158, 1, 1, 0.005, 0),
    settings: { seed: 'vh-sodium-2026', comparativeLot: 'NA-3105', candidateLot: 'NA-3118', runsFrom: '2026-11-04', runsTo: '2026-11-11', plannedSpecimens: 60 },
    finish: 'submitted',
  },
];

/** Invented reference values: log-normal around a median with a spread, per sex. Deterministic. */
function referenceValues(seed: string, groups: { sex: string | null; n: number; median: number; gsd: number }[], decimals: number) {
  const rng = seedrandom(seed);
  return groups.flatMap((g, k) => Array.from({ length: g.n }, (_, i) => ({
    label: `RI-${k + 1}${String(i + 1).padStart(3, '0')}`,
    value: (g.median * Math.exp(Math.log(g.gsd) * gaussian(rng))).toFixed(decimals),
    sex: g.sex,
  })));
}

interface DemoInterval { title: string; kind: 'interval-establish' | 'interval-verify'; analyte: string; instrument: string; purpose: string; rows: object[]; settings: StudySettingsPatch; finish: Finish; signComment?: string }

const INTERVALS: DemoInterval[] = [
  {
    title: 'Creatinine reference interval, adults (Chemistry line 2)', kind: 'interval-establish', analyte: 'Creatinine', instrument: 'Chemistry line 2',
    purpose: 'Establish the adult creatinine reference interval printed beside results (invented demo study).',
    rows: referenceValues('vh-ri-creatinine', [{ sex: 'F', n: 120, median: 64, gsd: 1.16 }, { sex: 'M', n: 120, median: 82, gsd: 1.15 }], 0),
    settings: { seed: 'vh-ri-creatinine-2026', partitionFields: ['sex'], reagentLot: 'CRE-2264',
      populationDescription: 'Healthy adult volunteers aged 18–65 recruited among blood donors (invented); excluded: known kidney disease, pregnancy, diabetes, nephrotoxic medication, strenuous exercise within 24 h.' },
    finish: 'draft',
  },
  {
    title: 'Potassium: verify the stated interval (Chemistry line 2)', kind: 'interval-verify', analyte: 'Potassium', instrument: 'Chemistry line 2',
    purpose: 'Verify that the manufacturer\'s potassium interval fits our population (invented demo study).',
    rows: referenceValues('vh-rv-potassium', [{ sex: null, n: 20, median: 4.2, gsd: 1.07 }], 1),
    settings: { seed: 'vh-rv-potassium-2026', statedLower: 3.5, statedUpper: 5.1, statedSource: 'Manufacturer\'s package insert (invented), adult serum' },
    finish: 'signed',
  },
  {
    title: 'Glucose: verify the stated interval (Chemistry line 2)', kind: 'interval-verify', analyte: 'Glucose', instrument: 'Chemistry line 2',
    purpose: 'Verify that the stated fasting glucose interval fits our population on the new chemistry line (invented demo study).',
    rows: referenceValues('vh-rv-glucose', [{ sex: null, n: 20, median: 4.9, gsd: 1.08 }], 1),
    settings: { seed: 'vh-rv-glucose-2026', statedLower: 3.9, statedUpper: 6.1, statedSource: 'Manufacturer\'s package insert (invented), fasting adult plasma' },
    finish: 'signed',
    signComment: 'All 20 local values lie within the stated interval; the stated interval is adopted.',
  },
  {
    title: 'Thyrotropin: verify the stated interval (Immunoassay 1)', kind: 'interval-verify', analyte: 'Thyrotropin (TSH)', instrument: 'Immunoassay 1',
    purpose: 'Verify the published TSH interval for our population (invented demo study; it does not fit).',
    rows: referenceValues('vh-rv-tsh', [{ sex: null, n: 20, median: 3.1, gsd: 1.45 }], 2),
    settings: { seed: 'vh-rv-tsh-2026', statedLower: 0.4, statedUpper: 4.0, statedSource: 'Published study of another population (invented citation)' },
    finish: 'draft',
  },
];

const COMMENTS: Record<string, string> = {
  'method-comparison': 'Meets the laboratory goal at every decision level; released for patient testing.',
  'interval-verify': 'One of 20 local values outside the stated interval; the stated interval is adopted.',
  'interval-establish': 'Interval adopted for the population described.',
};

/** The demo laboratory's analysed studies (skipped when a study of that title exists). */
export async function seedDemoStudies(db: Database, labId: number, publicUrl: string): Promise<void> {
  const seed = systemScope(labId, 'the demo seed');
  const [tech] = await db.select().from(users).where(eq(users.email, 'tech@valeharbor.example'));
  const me = toSignedIn(tech);
  const labInstruments = await db.select().from(instruments).where(seed.where(instruments));
  const byName = (n: string) => labInstruments.find((i) => i.name === n)!.id;
  const jobs = new AnalysisJobs(db, '');
  const [director] = await db.select().from(users).where(eq(users.email, 'director@valeharbor.example'));
  // No SMTP here: the mail the sign-off steps queue waits in the outbox until the app delivers it.
  const ctx: AppContext = { db, pool: null as never /* the seed signs nobody in, so no sign-in counts */, jobs, mail: new MailService(db, undefined, ''), config: { publicUrl } as AppContext['config'] };
  const finish = async (id: number, how: Finish, own?: string) => {
    if (how === 'draft') return;
    await submitStudy(ctx, me, id);
    if (how === 'signed') {
      const comment = own ?? COMMENTS[(await db.select({ kind: studies.kind }).from(studies).where(eq(studies.id, id)))[0].kind];
      await signStudy(ctx, toSignedIn(director), id, { meaning: 'accepted', comment, password: DEMO_PASSWORD }, 'demo seed');
    }
  };
  for (const demo of COMPARISONS) {
    const exists = await db.select({ id: studies.id }).from(studies).where(seed.where(studies, eq(studies.title, demo.title)));
    if (exists.length) continue;
    const [analyte] = await db.select().from(analytes).where(seed.where(analytes, eq(analytes.name, demo.analyte)));
    const body: CreateStudyBody = {
      kind: 'method-comparison', title: demo.title, purpose: demo.purpose, analyteId: analyte.id,
      comparativeInstrumentId: byName('Chemistry line 1'), candidateInstrumentId: byName('Chemistry line 2'), settings: demo.settings,
    };
    const study = await createStudy(db, me, body);
    await putRows(db, me, study.id, study.version, demo.rows);
    await analyseNow(db, jobs, me, study.id);
    await finish(study.id, demo.finish);
  }
  for (const demo of INTERVALS) {
    const exists = await db.select({ id: studies.id }).from(studies).where(seed.where(studies, eq(studies.title, demo.title)));
    if (exists.length) continue;
    const [analyte] = await db.select().from(analytes).where(seed.where(analytes, eq(analytes.name, demo.analyte)));
    const study = await createStudy(db, me, { kind: demo.kind, title: demo.title, purpose: demo.purpose, analyteId: analyte.id, instrumentId: byName(demo.instrument), settings: demo.settings });
    await putRows(db, me, study.id, study.version, demo.rows as Record<string, unknown>[]);
    await analyseNow(db, jobs, me, study.id);
    await finish(study.id, demo.finish, demo.signComment);
  }
  // The demos kinds bring themselves (server/kinds/<kind> demos); one instrument each.
  for (const kind of SERVER_KINDS) {
    for (const demo of kind.demos ?? []) {
      const exists = await db.select({ id: studies.id }).from(studies).where(seed.where(studies, eq(studies.title, demo.title)));
      if (exists.length) continue;
      const [analyte] = await db.select().from(analytes).where(seed.where(analytes, eq(analytes.name, demo.analyte)));
      const study = await createStudy(db, me, {
        kind: kind.meta.kind as CreateStudyBody['kind'], title: demo.title, purpose: demo.purpose, analyteId: analyte.id, instrumentId: byName(demo.instrument), settings: demo.settings,
      });
      await putRows(db, me, study.id, study.version, demo.rows);
      await analyseNow(db, jobs, me, study.id);
      await finish(study.id, demo.finish, demo.signComment ?? '');
    }
  }
  await seedDemoPlan(db, jobs, me, labId, byName);
  await seedDemoReleases(ctx, labId, me, toSignedIn(director));
}

/** A draft comparison planned before any specimen is drawn: its plan by simulation set and run (invented figures). */
export const DEMO_PLAN_TITLE = 'Potassium: Chemistry line 2 against line 1 (planned)';
async function seedDemoPlan(db: Database, jobs: AnalysisJobs, me: ReturnType<typeof toSignedIn>, labId: number, byName: (n: string) => number): Promise<void> {
  const seed = systemScope(labId, 'the demo seed');
  const exists = await db.select({ id: studies.id }).from(studies).where(seed.where(studies, eq(studies.title, DEMO_PLAN_TITLE)));
  if (exists.length) return;
  const [analyte] = await db.select().from(analytes).where(seed.where(analytes, eq(analytes.name, 'Potassium')));
  const study = await createStudy(db, me, {
    kind: 'method-comparison', title: DEMO_PLAN_TITLE, analyteId: analyte.id,
    purpose: 'How many specimens does the potassium comparison need? Planned by simulation before any specimen is drawn (invented demo study).',
    comparativeInstrumentId: byName('Chemistry line 1'), candidateInstrumentId: byName('Chemistry line 2'),
    settings: {
      seed: 'vh-potassium-plan-2026', regression: 'deming', demingRatio: 0.73,
      samplePlan: { errorModel: 'constant', cvComparative: 0.06, cvCandidate: 0.07, low: 2.8, high: 6.8, shape: 'uniform', n: [40, 60, 80, 100, 120, 160, 200], simulations: 1000 },
    } as CreateStudyBody['settings'],
  });
  await planNow(db, jobs, me, study.id);
}
