import { createHash } from 'node:crypto';
import { parseKindSettings } from '@shared/kinds/settings';
import { analyzeReportableRange } from '@shared/stats/analyze-reportable-range';
import type { RangeRow } from '@shared/stats/reportable-range-types';
import type { ReportRow, StudyReport } from '../../reports/report-model';
import { RANGE_RULES } from '@shared/kinds/reportable-range/meta';

/*
 * An invented reportable-range study for the report's and the Results sheet's tests (the scenario is ours): urea in
 * mmol/L to 0.1 at seven levels with assigned values 2 to 32 mmol/L, two replicates each. The response runs straight up
 * to 27 mmol/L and curves off at the top level (about 30.5 for 32), so that level's deviation from linearity lies
 * beyond the allowable 0.5 mmol/L or 1.5% and the verified range ends one level short of the claimed high end. One extra
 * result of level 4 is excluded with a reason. The results are the real engine's (analyzeReportableRange).
 */

export const LEVEL_VALUES = [2, 7, 12, 17, 22, 27, 32];
export const RESULTS: number[][] = [[2.0, 2.1], [7.1, 6.9], [12.0, 12.1], [17.1, 16.9], [21.8, 22.0], [27.0, 26.8], [30.4, 30.6]];
export const EXCLUDED_REASON = 'Short sample flagged by the analyser; run again from the same mixture';
export const GOAL_SOURCE = 'Laboratory quality goal for urea linearity, set by the director (invented)';

/** The grid rows: level, replicate, result as typed; an excluded extra result of "Level 4" after its replicate 1. */
export function rangeRows(results = RESULTS): ReportRow[] {
  const rows: Omit<ReportRow, 'position'>[] = [];
  results.forEach((values, i) => values.forEach((value, k) => {
    const row = {
      label: '', comparative: null, candidate: null, value, valueText: value.toFixed(1), sex: null, ageBand: null,
      excluded: false, exclusionReason: null, note: '', level: `Level ${i + 1}`, replicate: k + 1,
    };
    if (i === 3 && k === 1) {
      rows.push({ ...row, value: 15.2, valueText: '15.2', excluded: true, exclusionReason: EXCLUDED_REASON });
      rows.push({ ...row, note: 'Run again after the short sample: first result 15.2 mmol/L' });
    } else rows.push(row);
  }));
  return rows.map((r, k) => ({ ...r, position: k + 1 }) as ReportRow);
}

export const LEVELS = LEVEL_VALUES.map((assigned, i) => ({ name: `Level ${i + 1}`, assigned, fraction: null }));

/** The study's settings and its report, its results from the real engine as the worker would make them. */
export function rangeStudyReport(rows = rangeRows(), own: Record<string, unknown> = {}): StudyReport {
  const settings = parseKindSettings('reportable-range', {
    ...RANGE_RULES, decimals: 1, unit: 'mmol/L', seed: 'range-report-test', resamples: 2000, reagentLot: 'UREA-2611',
    runsFrom: '2026-11-23', runsTo: '2026-11-24',
    levels: LEVELS, replicates: 2, allowableNonlinearity: 0.5, allowableNonlinearityPercent: 1.5, nonlinearitySource: GOAL_SOURCE,
    claimedLow: 2, claimedHigh: 32, alpha: 0.05, ...own,
  });
  const s = settings as typeof settings & Record<string, never>;
  const engineRows = rows.filter((r) => r.value !== null).map((r): RangeRow => ({
    level: String(r.level), replicate: r.replicate as number, value: r.value!, excluded: r.excluded,
    exclusionReason: r.exclusionReason ?? undefined, position: r.position,
  }));
  const analysed = analyzeReportableRange(engineRows, {
    levels: s.levels, poolLow: s.poolLow, poolHigh: s.poolHigh, replicates: s.replicates,
    allowableNonlinearity: s.allowableNonlinearity, allowableNonlinearityPercent: s.allowableNonlinearityPercent,
    claimedLow: s.claimedLow, claimedHigh: s.claimedHigh, alpha: s.alpha, confidenceLevel: settings.confidenceLevel,
    resamples: settings.resamples, seed: settings.seed, decimals: settings.decimals, unit: 'mmol/L',
  });
  // The source of the goal is record-only: the server adds it where results are served (index.ts recordedWords).
  const results = { ...analysed, goal: { ...analysed.goal, source: GOAL_SOURCE } };
  return {
    laboratory: { name: 'Vale Harbor Regional Laboratory', timeZone: 'America/Halifax' },
    study: { id: 61, kind: 'reportable-range', title: 'Urea, serum: reportable range of the new chemistry analyser', purpose: 'Verify linearity and recovery across the manufacturer’s claimed measuring interval before release.', state: 'signed', supersedesId: null },
    analyte: { name: 'Urea', unit: 'mmol/L' },
    instruments: { instrument: { name: 'Satellite chemistry 2', model: 'Harborline C-350', serial: 'HL3-10988' } },
    settings, engineVersion: results.engine.version, rows, results: results as unknown as StudyReport['results'],
    amendments: [],
    planApproval: { signerName: 'Dr. Imani Okafor', signedAt: new Date('2026-11-20T12:30:00Z'), comment: 'Seven levels across the claimed interval' },
    signature: { signerName: 'Dr. Imani Okafor', meaning: 'accepted', comment: 'Report urea up to 27 mmol/L; dilute above it until the top is verified.', signedAt: new Date('2026-12-02T13:14:00Z') },
    contentHash: createHash('sha256').update(JSON.stringify({ rows, settings })).digest('hex'),
    verificationCode: 'PX-7Q3L-R2KD',
    draft: false,
    generatedAt: new Date('2026-12-02T13:14:30Z'),
  };
}
