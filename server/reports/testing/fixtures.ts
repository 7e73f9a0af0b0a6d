import { createHash } from 'node:crypto';
import { StudySettings, type StudySettingsPatch } from '@shared/schemas';
import { analyzeComparison, analyzeInterval } from '@shared/stats';
import { planOptionsFor, SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import { planComparison } from '@shared/stats/plan-comparison';
import { withRecordedWords } from '../../analyses/recorded-words';
import { runAnalysis } from '../../analyses/run-analysis';
import { analysedSettings, type AnalysedRow } from '../../specimens/input-hash';
import type { ReportRow, StudyReport } from '../report-model';

/**
 * Invented studies for the report's tests, with results made by the real statistics engine.
 * The numbers come from a fixed linear congruential sequence, so every run sees the same data.
 */
export function sequence(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
}

const blankRow = (position: number): ReportRow => ({
  position, label: `VH-${String(position).padStart(4, '0')}`, comparative: null, candidate: null, value: null,
  sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '',
});

/** Glucose pairs over 2–25 mmol/L with a proportional bias (y ≈ 1.03x + 0.02), row 7 excluded; reported to `decimals` (0.1 mmol/L). */
export function comparisonRows(count: number, decimals = 1): ReportRow[] {
  const next = sequence(20261202);
  return Array.from({ length: count }, (_, k) => {
    const x = Number((2 + 23 * next()).toFixed(decimals));
    const y = Number((1.03 * x + 0.02 + (next() - 0.5) * 0.3).toFixed(decimals));
    const excluded = k === 6;
    return {
      ...blankRow(k + 1), comparative: x, candidate: y, excluded,
      exclusionReason: excluded ? 'Haemolysed specimen (H-index 3+); comparative result run outside the 2-hour window' : null,
      note: k === 11 ? 'Repeated on the candidate: first result 8.1 → 8.4 mmol/L after recalibration' : '',
    };
  });
}

const base = (kind: StudyReport['study']['kind'], settings: StudySettings, rows: ReportRow[]): Omit<StudyReport, 'results'> => ({
  laboratory: { name: 'Vale Harbor Regional Laboratory', timeZone: 'America/Halifax' },
  study: { id: 42, kind, title: 'Glucose, plasma: new chemistry analyser against the core-laboratory analyser', purpose: 'Verify the candidate analyser before it reports patient results; µ, ±, σ, ≤, ≥, −, λ, ² → all printable.', state: 'signed', supersedesId: 17 },
  analyte: { name: 'Glucose', unit: 'mmol/L' },
  instruments: {
    comparative: { name: 'Core chemistry 1', model: 'Harborline C-700', serial: 'HL7-00231' },
    candidate: { name: 'Satellite chemistry 2', model: 'Harborline C-350', serial: 'HL3-10988' },
    instrument: { name: 'Core chemistry 1', model: 'Harborline C-700', serial: 'HL7-00231' },
  },
  settings, engineVersion: 'parallax-stats 1.1.0 (xor128)', rows,
  amendments: [{
    at: new Date('2026-11-20T14:05:00Z'), by: 'Dr. Imani Okafor', field: 'Allowable bias',
    from: '0.25 mmol/L', to: '0.3 mmol/L or 5%', reason: 'Goal source updated to the 2024 proficiency-testing limits (laboratory policy QP-12 rev 4)',
  }],
  planApproval: { signerName: 'Dr. Imani Okafor', signedAt: new Date('2026-11-02T12:30:00Z'), comment: 'Plan fits; 40 specimens over 5 days' },
  signature: { signerName: 'Dr. Imani Okafor', meaning: 'accepted', comment: 'Bias acceptable at the low levels; high-level bias reviewed with the clinical team.', signedAt: new Date('2026-12-02T13:14:00Z') },
  contentHash: createHash('sha256').update(JSON.stringify({ kind, rows, settings })).digest('hex'),
  verificationCode: 'PX-7K3M-Q9TD',
  draft: false,
  generatedAt: new Date('2026-12-02T13:14:30Z'),
});

export const COMPARISON_SETTINGS: StudySettingsPatch = {
  resamples: 2000, regressionResamples: 1000, seed: 'report-test', decimals: 1, unit: 'mmol/L',
  decisionLevels: [3, 10, 20], allowableBiasAbsolute: 0.3, allowableBiasSource: 'Laboratory policy QP-12: 2024 proficiency-testing limit used as allowable bias',
  comparativeLot: 'GLU-2611A', candidateLot: 'GLU-2611C', runsFrom: '2026-11-03', runsTo: '2026-11-09', plannedSpecimens: 40,
};

/** A method comparison of `count` pairs, analysed by analyzeComparison as the server's worker would. */
export function comparisonReport(count = 40, patch: StudySettingsPatch = {}, rows = comparisonRows(count)): StudyReport {
  const settings = StudySettings.parse({ ...COMPARISON_SETTINGS, ...patch });
  const results = analyzeComparison(rows.map((r) => ({
    x: r.comparative!, y: r.candidate!, label: r.label, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined,
  })), {
    resamples: settings.resamples, regressionResamples: settings.regressionResamples, seed: settings.seed, level: settings.confidenceLevel,
    regression: settings.regression, demingRatio: settings.demingRatio, difference: settings.differenceType,
    decisionLevels: settings.decisionLevels, allowableBias: settings.allowableBiasAbsolute ?? undefined,
    allowableBiasPercent: settings.allowableBiasPercent ?? undefined, decimals: settings.decimals,
  });
  return { ...base('method-comparison', settings, rows), results };
}

/** The invented plan of the glucose comparison: CVs of 2% and 2.5%, true values spread evenly over 2–25 mmol/L. */
export const SAMPLE_PLAN: Partial<SamplePlan> = {
  errorModel: 'proportional', cvComparative: 2, cvCandidate: 2.5, low: 2, high: 25, shape: 'uniform',
  n: [20, 40, 60, 80, 100, 120], simulations: 100, targetPower: 0.8, maxFalsePass: 0.05,
};

/**
 * The glucose comparison with a plan by simulation set (`plan` over SAMPLE_PLAN) and its run, made by the real
 * planning engine with 100 resamples per simulated study (for the tests' speed); `run: false` leaves the plan unrun.
 */
export function comparisonPlanReport(plan: Partial<SamplePlan> = {}, patch: StudySettingsPatch = {}, run = true): StudyReport {
  const report = comparisonReport(40, patch);
  const samplePlan = SamplePlan.parse({ ...SAMPLE_PLAN, ...plan });
  const settings = { ...report.settings, samplePlan };
  if (!run) return { ...report, settings, samplePlan: null };
  const results = planComparison({ ...planOptionsFor(settings)!, resamples: 100 });
  return { ...report, settings, samplePlan: { plan: samplePlan, results, runId: 311, finishedAt: new Date('2026-11-02T11:48:00Z') } };
}

/**
 * Sodium pairs in whole mmol/L over 125–155 with a constant bias of about +1 mmol/L and little noise,
 * so the bootstrap CIs of the median bias and of the decision-level bias collapse to one value.
 */
export function sodiumRows(count: number): ReportRow[] {
  const next = sequence(11);
  const noise = () => (next() + next() + next() - 1.5) * 1.2;
  return Array.from({ length: count }, (_, k) => {
    const truth = 125 + 30 * next();
    return { ...blankRow(k + 1), comparative: Math.round(truth + noise()), candidate: Math.round(truth + 1 + noise()) };
  });
}

/** A sodium comparison in whole mmol/L (decisions at 130 and 150, allowable bias 2 mmol/L), analysed as the worker would. */
export function sodiumComparisonReport(count = 60): StudyReport {
  const report = comparisonReport(count, {
    decimals: 0, decisionLevels: [130, 150], allowableBiasAbsolute: 2, allowableBiasPercent: null,
    allowableBiasSource: 'Laboratory goal set by the director (2026): 2 mmol/L at each decision level',
  }, sodiumRows(count));
  return { ...report, study: { ...report.study, title: 'Sodium, serum: new chemistry analyser against the core-laboratory analyser' }, analyte: { name: 'Sodium', unit: 'mmol/L' } };
}

/** Sodium-like values (mmol/L) for reference intervals: `count` values, every 15th excluded; `spread` the SD, `shift` the men's offset. */
export function intervalRows(count: number, spread = 2.4, shift = 0.4): ReportRow[] {
  const next = sequence(7001);
  return Array.from({ length: count }, (_, k) => {
    const z = Array.from({ length: 12 }, next).reduce((a, b) => a + b, 0) - 6;
    const excluded = k % 15 === 14;
    return {
      ...blankRow(k + 1), value: Number((140 + spread * z + (k % 2 ? shift : 0)).toFixed(0)), sex: k % 2 ? 'M' : 'F',
      ageBand: k % 3 ? '18–64' : '65+', excluded, exclusionReason: excluded ? 'On diuretics (questionnaire)' : null,
    };
  });
}

/** An establishment from `rows` (by default 2.4 mmol/L wide, men 0.4 higher: one common interval). */
export function establishReport(count = 130, rows = intervalRows(count)): StudyReport {
  const settings = StudySettings.parse({ resamples: 1000, seed: 'report-test', decimals: 0, confidenceLevel: 0.9, partitionFields: ['sex'], populationDescription: 'Healthy adult volunteers, fasting, from the laboratory’s catchment area', reagentLot: 'NA-2611' });
  const results = analyzeInterval(rows.map((r) => ({ value: r.value!, sex: r.sex ?? undefined, excluded: r.excluded })), {
    resamples: settings.resamples, seed: settings.seed, level: settings.confidenceLevel, method: settings.intervalMethod,
    percentiles: settings.percentiles, partitionFields: settings.partitionFields, decimals: settings.decimals,
  });
  const report = base('interval-establish', settings, rows);
  return { ...report, study: { ...report.study, title: 'Sodium, serum: local reference interval' }, analyte: { name: 'Sodium', unit: 'mmol/L' }, results };
}

/**
 * What a study's PDF prints from: the results the app's analysis makes of these rows and settings (runAnalysis on
 * the analysed input, as the worker runs it: record-only settings left out), with the study's record-only words
 * added as wherever results are served (withRecordedWords). Never a result rebuilt by hand beside the analysis.
 */
export function servedResults(kind: string, settings: StudySettings, rows: ReportRow[]): unknown {
  const analysed: AnalysedRow[] = rows.map((r) => ({
    position: r.position, label: r.label, comparative: r.comparative, candidate: r.candidate, value: r.value,
    comparativeText: null, candidateText: null, valueText: r.value === null ? null : String(r.value),
    sex: r.sex, ageBand: r.ageBand, excluded: r.excluded, exclusionReason: r.exclusionReason,
  }));
  return withRecordedWords(runAnalysis({ kind, settings: analysedSettings(settings, kind), rows: analysed }), settings);
}

export function verifyReport(count = 20, stated = { lower: 137, upper: 143 }): StudyReport {
  const settings = StudySettings.parse({ decimals: 0, statedLower: stated.lower, statedUpper: stated.upper, statedSource: 'Manufacturer’s insert, rev. 2025-06' });
  const rows = intervalRows(count);
  const report = base('interval-verify', settings, rows);
  return {
    ...report, study: { ...report.study, title: 'Sodium, serum: verify the manufacturer’s interval' }, analyte: { name: 'Sodium', unit: 'mmol/L' },
    results: servedResults('interval-verify', settings, rows) as StudyReport['results'],
  };
}
