import seedrandom from 'seedrandom';
import { and, eq } from 'drizzle-orm';
import type { CreateStudyBody, StudySettingsPatch } from '../../shared/schemas';
import { analyseNow } from '../analyses/analyses.service';
import { AnalysisJobs } from '../analyses/analysis-jobs';
import { toSignedIn } from '../auth/auth.service';
import { putRows } from '../specimens/specimens.service';
import { createStudy } from '../studies/studies.service';
import type { Database } from './client';
import { analytes, instruments, studies, users } from './schema';

/** Invented pairs: y = slope·x + offset, with noise proportional to x (CV) and a floor. Deterministic. */
function pairs(seed: string, n: number, lo: number, hi: number, slope: number, offset: number, cv: number, decimals: number) {
  const rng = seedrandom(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
  return Array.from({ length: n }, (_, i) => {
    const truth = lo * Math.pow(hi / lo, rng());
    const x = truth * (1 + cv * normal());
    const y = (slope * truth + offset) * (1 + cv * normal());
    return { label: `VH-${String(1000 + i * 7)}`, comparative: x.toFixed(decimals), candidate: y.toFixed(decimals) };
  });
}

interface DemoComparison { title: string; analyte: string; purpose: string; rows: ReturnType<typeof pairs>; settings: StudySettingsPatch }

const COMPARISONS: DemoComparison[] = [
  {
    title: 'Glucose: Chemistry line 2 against line 1',
    analyte: 'Glucose',
    purpose: 'Verify the new chemistry line before it reports patient glucose results (invented demo study).',
    rows: pairs('vh-glucose', 60, 2.5, 25, 1.005, 0.02, 0.012, 1),
    settings: { seed: 'vh-glucose-2026', comparativeLot: 'GLU-4471', candidateLot: 'GLU-4502', runsFrom: '2026-11-02', runsTo: '2026-11-09', plannedSpecimens: 60 },
  },
  {
    title: 'Creatinine: Chemistry line 2 against line 1',
    analyte: 'Creatinine',
    purpose: 'Verify creatinine on the new chemistry line; the candidate reads proportionally high (invented demo study).',
    rows: pairs('vh-creatinine', 80, 40, 900, 1.075, -2, 0.02, 0),
    settings: { seed: 'vh-creatinine-2026', comparativeLot: 'CRE-2210', candidateLot: 'CRE-2264', runsFrom: '2026-11-03', runsTo: '2026-11-12', plannedSpecimens: 80 },
  },
];

/** The demo laboratory's analysed studies (skipped when a study of that title exists). */
export async function seedDemoStudies(db: Database, labId: number): Promise<void> {
  const [tech] = await db.select().from(users).where(eq(users.email, 'tech@valeharbor.example'));
  const me = toSignedIn(tech);
  const labInstruments = await db.select().from(instruments).where(eq(instruments.laboratoryId, labId));
  const byName = (n: string) => labInstruments.find((i) => i.name === n)!.id;
  const jobs = new AnalysisJobs(db, '');
  for (const demo of COMPARISONS) {
    const exists = await db.select({ id: studies.id }).from(studies).where(and(eq(studies.laboratoryId, labId), eq(studies.title, demo.title)));
    if (exists.length) continue;
    const [analyte] = await db.select().from(analytes).where(and(eq(analytes.laboratoryId, labId), eq(analytes.name, demo.analyte)));
    const body: CreateStudyBody = {
      kind: 'method-comparison', title: demo.title, purpose: demo.purpose, analyteId: analyte.id,
      comparativeInstrumentId: byName('Chemistry line 1'), candidateInstrumentId: byName('Chemistry line 2'), settings: demo.settings,
    };
    const study = await createStudy(db, me, body);
    await putRows(db, me, study.id, study.version, demo.rows);
    await analyseNow(db, jobs, me, study.id);
  }
}
