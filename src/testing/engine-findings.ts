import type { Analysis, HistoryEvent, Signature, SpecimenRow, SpecimenRows, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { analyzeComparison } from '@shared/stats/analyze-comparison';
import type { ComparisonResult } from '@shared/stats';

/**
 * API answers for the client's component tests, made the way the server makes them: the study as GET /studies/:id
 * answers it, its rows as GET /studies/:id/specimens does, and the findings by the real engine (`analyzeComparison`
 * with the options server/kinds/method-comparison/index.ts passes it), never typed by hand.
 */

/** The invented glucose comparison's settings: three decision levels, an allowable bias of 0.4 mmol/L. */
export const GLUCOSE_SETTINGS = StudySettings.parse({
  resamples: 1000, regressionResamples: 1000, seed: 'h8-component-tests', decimals: 1, unit: 'mmol/L',
  decisionLevels: [4, 10, 20], allowableBiasAbsolute: 0.4, allowableBiasSource: 'Laboratory policy QP-12 (invented for the tests)',
});

/** A method-comparison study as GET /api/v1/studies/:id answers it. */
export function glucoseStudy(patch: Partial<Study> = {}): Study {
  return {
    id: 12, kind: 'method-comparison', title: 'Glucose: line 2 against line 1', analyte: { id: 1, name: 'Glucose' }, instruments: 'Line 1 → Line 2',
    n: 40, state: 'draft', superseded: false, findings: 'current', updatedAt: '2026-11-30T10:00:00.000Z', createdBy: { id: 3, name: 'Tomas Reyes' },
    purpose: '', analyteUnit: 'mmol/L', comparativeInstrument: null, candidateInstrument: null, instrument: null, settings: GLUCOSE_SETTINGS,
    version: 4, supersedesId: null, supersededById: null, latestAnalysisId: 8, currentAnalysisId: 8, canBeNegative: false,
    createdAt: '2026-11-29T10:00:00.000Z', returnComment: null, submissionNote: null, mayISign: { allowed: false, why: 'Only a director may sign.' },
    release: null, ...patch,
  };
}

/**
 * 40 invented glucose pairs over 3–22 mmol/L: the candidate reads about 2.5% high, with a small wobble; row 17 (label
 * G17) reads 2 mmol/L high, an outlier of the differences. Rounded to the study's one decimal, as a person enters them
 * (the texts as entered beside the numbers, as the API keeps them).
 */
export function glucoseRows(count = 40): SpecimenRow[] {
  return Array.from({ length: count }, (_, i) => {
    const x = Math.round((3 + (19 * i) / (count - 1)) * 10) / 10;
    const y = Math.round((x * 1.025 + 0.15 * Math.sin(i * 1.7) + (i === 16 ? 2 : 0)) * 10) / 10;
    return {
      position: i + 1, label: `G${String(i + 1).padStart(2, '0')}`, comparative: x, candidate: y, value: null,
      comparativeText: x.toFixed(1), candidateText: y.toFixed(1), valueText: null, sex: null, ageBand: null,
      excluded: false, exclusionReason: null, note: '', uploadId: null,
    };
  });
}

/** GET /api/v1/studies/:id/specimens. */
export function specimensAnswer(rows: SpecimenRow[], version = 4): SpecimenRows {
  return { version, rows, warnings: [] };
}

/** The comparison the server's worker stores for these rows and settings (server/kinds/method-comparison/index.ts). */
export function engineComparison(rows: readonly SpecimenRow[], settings = GLUCOSE_SETTINGS): ComparisonResult {
  const used = rows.filter((r) => r.comparative !== null && r.candidate !== null);
  return analyzeComparison(
    used.map((r) => ({ x: r.comparative!, y: r.candidate!, label: r.label || undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
    {
      resamples: settings.resamples, regressionResamples: settings.regressionResamples, seed: settings.seed, level: settings.confidenceLevel,
      interval: settings.interval, loaMultiplier: settings.loaMultiplier, difference: settings.differenceType, regression: settings.regression,
      demingRatio: settings.demingRatio, decisionLevels: settings.decisionLevels, allowableBias: settings.allowableBiasAbsolute ?? undefined,
      allowableBiasPercent: settings.allowableBiasPercent ?? undefined, esdAlpha: settings.esdAlpha, esdMax: settings.esdMax ?? undefined,
      decimals: settings.decimals,
    },
  );
}

let cached: { rows: SpecimenRow[]; results: ComparisonResult } | null = null;
/** The 40 glucose rows and their findings, computed once per test file (the engine takes a moment). */
export function glucoseFindings(): { rows: SpecimenRow[]; results: ComparisonResult } {
  if (!cached) {
    const rows = glucoseRows();
    cached = { rows, results: engineComparison(rows) };
  }
  return JSON.parse(JSON.stringify(cached)) as { rows: SpecimenRow[]; results: ComparisonResult };
}

/** GET /api/v1/analyses/:id of a finished run. */
export function doneAnalysis(results: unknown, patch: Partial<Analysis> = {}): Analysis {
  const engine = (results as { engine?: { version?: string; seed?: string; resamples?: number } } | null)?.engine;
  return {
    id: 8, studyId: 12, state: 'done', progress: 1, engineVersion: engine?.version ?? '1.2.0', seed: engine?.seed ?? 'parallax',
    resamples: engine?.resamples ?? 0, inputHash: 'f'.repeat(64), current: true, results, error: null,
    queuedAt: '2026-11-30T10:00:00.000Z', startedAt: '2026-11-30T10:00:01.000Z', finishedAt: '2026-11-30T10:00:04.200Z', durationMs: 3200, ...patch,
  };
}

/** A signature as GET /studies/:id/signatures lists it. */
export function signature(patch: Partial<Signature> = {}): Signature {
  return {
    id: 5, meaning: 'accepted', meaningWords: 'Accepted', signerName: 'Dr. Imani Okafor', comment: 'Bias acceptable at every level.',
    signedAt: '2026-12-01T09:14:00.000Z', contentHash: 'a'.repeat(64), verificationCode: 'PX-7K3M-Q9TD', pdfSha256: 'b'.repeat(64),
    analysisId: 8, ...patch,
  };
}

/** An event as GET /studies/:id/history lists it. */
export function historyEvent(patch: Partial<HistoryEvent> = {}): HistoryEvent {
  return {
    id: 90, at: '2026-11-30T11:00:00.000Z', userId: 3, userName: 'Tomas Reyes', studyId: 12, action: 'study.updated', entity: 'study',
    headline: 'Settings changed', details: [], ...patch,
  };
}
