import { sql } from 'drizzle-orm';
import { RANGE_LEVELS, RANGE_RULES, RangeSettings, reportableRangeMeta } from '@shared/kinds/reportable-range/meta';
import { parseKindSettings, type KindSettings } from '@shared/kinds/settings';
import { analyzeReportableRange } from '@shared/stats/analyze-reportable-range';
import type { RangeResult, RangeRow } from '@shared/stats/reportable-range-types';
import type { ServerKind } from '../kind';
import { RANGE_DEMOS } from './demo';
import { rangeReport } from './report';
import { rangeSheet } from './results-sheet';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);


/** Reportable range on the server: linearity and recovery across the claimed measuring interval (CLSI EP06 practice). */
export const reportableRangeKind: ServerKind = {
  meta: reportableRangeMeta,
  initialSettings: () => ({ ...RANGE_RULES }),
  analyse(input, onProgress) {
    const s = parseKindSettings(input.kind, input.settings) as KindSettings & RangeSettings;
    if (!s.levels.length) throw new Error('Name the levels with their assigned values or mixing fractions in Setup before running the analysis');
    const rows: RangeRow[] = input.rows.filter((r) => r.value !== null).map((r) => ({
      level: String(r.extra?.level ?? ''),
      replicate: typeof r.extra?.replicate === 'number' ? r.extra.replicate : null,
      value: r.value!, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined, position: r.position,
    }));
    return analyzeReportableRange(rows, {
      levels: s.levels, poolLow: s.poolLow, poolHigh: s.poolHigh, replicates: s.replicates,
      allowableNonlinearity: s.allowableNonlinearity, allowableNonlinearityPercent: s.allowableNonlinearityPercent,
      claimedLow: s.claimedLow, claimedHigh: s.claimedHigh, alpha: s.alpha,
      confidenceLevel: s.confidenceLevel, resamples: s.resamples, seed: s.seed, decimals: s.decimals, unit: s.unit,
    }, onProgress);
  },
  submissionProblems(s) {
    const own = RangeSettings.safeParse(s);
    if (!own.success) return [{ path: 'settings.levels', message: 'Correct the levels in Setup' }];
    const problems: { path: string; message: string }[] = [];
    if (own.data.levels.length < RANGE_LEVELS.fewest) problems.push({ path: 'settings.levels', message: `Name at least ${RANGE_LEVELS.fewest} levels (CLSI EP06 practice: ${RANGE_LEVELS.fewest} to ${RANGE_LEVELS.most})` });
    if (own.data.allowableNonlinearity === null && own.data.allowableNonlinearityPercent === null) {
      problems.push({ path: 'settings.allowableNonlinearity', message: 'Give the allowable nonlinearity (in the unit or in %)' });
    }
    if (!own.data.nonlinearitySource.trim()) problems.push({ path: 'settings.nonlinearitySource', message: 'Name the source of the allowable nonlinearity' });
    return problems;
  },
  /** The source of the allowable nonlinearity is record-only: the findings show the study's as it stands (analyses/recorded-words.ts). */
  recordedWords: (results, settings) => (isObject(results.goal)
    ? { ...results, goal: { ...results.goal, source: typeof settings.nonlinearitySource === 'string' ? settings.nonlinearitySource : '' } } : results),
  archiveVerdict: sql`CASE WHEN results->>'verdict' IN ('range-verified', 'range-shortened', 'range-not-verified') THEN results->>'verdict' ELSE NULL END`,
  report: (layout, report, results) => rangeReport(layout, report, results as RangeResult | null),
  keyFigures: (results) => [(results as RangeResult).verdictWords],
  resultsSheet: rangeSheet,
  demos: RANGE_DEMOS,
};
