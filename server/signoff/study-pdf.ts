import { parseKindSettings } from '@shared/kinds/settings';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { and, asc, desc, eq } from 'drizzle-orm';
import { show } from '@shared/types/audit-words';
import { StudySettings, type StudyKind, type StudyState } from '@shared/schemas';
import type { Executor } from '../db/client';
import { analyses, analytes, auditEvents, instruments, laboratories, signatures } from '../db/schema';
import { withRecordedWords } from '../analyses/recorded-words';
import { renderStudyReport } from '../reports/render-report';
import type { Amendment, InstrumentInfo, ReportResults, ReportSamplePlan, StudyReport } from '../reports/report-model';
import { currentPlanRun, hasSamplePlan } from '../plans/plans.service';
import { loadRows } from '../specimens/input-hash';
import { rowView } from '../specimens/specimens.service';
import type { StudyRow } from '../studies/studies.repository';

export interface PdfSigning {
  draft: boolean; contentHash: string; verificationCode: string;
  signerName?: string; meaning?: string; comment?: string; signedAt?: Date;
}

async function instrument(db: Executor, id: number | null): Promise<InstrumentInfo | undefined> {
  if (id === null) return undefined;
  const [i] = await db.select().from(instruments).where(eq(instruments.id, id));
  return i ? { name: i.name, model: i.model, serial: i.serial } : undefined;
}

/** Criteria moved after the plan was approved, from the study's history. */
async function amendmentsOf(db: Executor, studyId: number): Promise<Amendment[]> {
  const events = await db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, 'study.plan-amended'))).orderBy(asc(auditEvents.id));
  return events.flatMap((e) => Object.entries((e.before ?? {}) as Record<string, unknown>).map(([field, from]) => ({
    at: e.at, by: e.userName ?? '', field, from: show(from), to: show((e.after as Record<string, unknown>)[field]), reason: e.reason ?? '',
  })));
}

/** The finished run of the comparison's plan as it is set now, or null (no plan, or none run for these settings). */
async function samplePlanOf(db: Executor, study: StudyRow, settings: Record<string, unknown>): Promise<ReportSamplePlan | null> {
  if (!hasSamplePlan(study)) return null;
  const run = await currentPlanRun(db, study);
  if (!run?.results || !run.finishedAt) return null;
  return { plan: settings.samplePlan as SamplePlan, results: run.results as ComparisonPlanResult, runId: run.id, finishedAt: run.finishedAt };
}

/** Builds the report's data from the database and renders it (signed: at signing; otherwise a DRAFT preview). */
export async function renderStudyPdf(db: Executor, study: StudyRow, analysisId: number | null, signing: PdfSigning): Promise<Buffer> {
  const [lab] = await db.select().from(laboratories).where(eq(laboratories.id, study.laboratoryId));
  const [analyte] = await db.select().from(analytes).where(eq(analytes.id, study.analyteId));
  const analysis = analysisId === null ? undefined : (await db.select().from(analyses).where(eq(analyses.id, analysisId)))[0];
  const [plan] = await db.select().from(signatures).where(and(eq(signatures.studyId, study.id), eq(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id)).limit(1);
  const settings = parseKindSettings(study.kind, study.settings);
  const report: StudyReport = {
    laboratory: { name: lab.name, timeZone: lab.timeZone },
    study: { id: study.id, kind: study.kind as StudyKind, title: study.title, purpose: study.purpose, state: (signing.draft ? study.state : 'signed') as StudyState, supersedesId: study.supersedesId },
    // The study's unit, as its findings page shows it (the analyte's unless the study changed it).
    analyte: { name: analyte.name, unit: StudySettings.parse(study.settings).unit || analyte.unit },
    instruments: {
      comparative: await instrument(db, study.comparativeInstrumentId),
      candidate: await instrument(db, study.candidateInstrumentId),
      instrument: await instrument(db, study.instrumentId),
    },
    settings,
    engineVersion: analysis?.engineVersion ?? '',
    rows: (await loadRows(db, study.id)).map(rowView),
    results: (withRecordedWords(analysis?.results, study.settings) as ReportResults | undefined) ?? null,
    amendments: await amendmentsOf(db, study.id),
    planApproval: plan ? { signerName: plan.signerName, signedAt: plan.signedAt, comment: plan.comment } : null,
    samplePlan: await samplePlanOf(db, study, settings),
    signature: signing.draft || !signing.signedAt
      ? null
      : { signerName: signing.signerName!, meaning: signing.meaning as 'accepted' | 'not-accepted', comment: signing.comment ?? '', signedAt: signing.signedAt },
    contentHash: signing.contentHash,
    verificationCode: signing.verificationCode,
    draft: signing.draft,
    generatedAt: signing.signedAt ?? new Date(),
  };
  return renderStudyReport(report);
}
