import { sql } from 'drizzle-orm';
import { intervalVerifyMeta } from '@shared/kinds/interval-verify/meta';
import { StudySettings } from '@shared/schemas';
import { CAUTION } from '@shared/stats/comparison-types';
import { engineInfo } from '@shared/stats/engine';
import { outsideStated, verifyInterval } from '@shared/stats/verify-interval';
import { has, withRepeatedLabels } from '../../analyses/analysis-rows';
import { valueColumns, verifyLines } from '../../audit/results-sheet';
import type { VerifyFindings } from '../../reports/report-model';
import { verifyReport } from '../../reports/sections/verify-report';
import { INTERVAL_OUTLIER_RULE } from '../interval-establish';
import type { ServerKind } from '../kind';
import { formatNumber, withUnit } from '@shared/types/findings-numbers';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Verifying a stated reference interval (transference) on the server. */
export const intervalVerifyKind: ServerKind = {
  meta: intervalVerifyMeta,
  initialSettings: () => ({
    confidenceLevel: 0.9,
    acceptanceRule: 'Accept the stated interval when at most 10% of the local values (2 of 20) fall outside it',
    outlierRule: INTERVAL_OUTLIER_RULE,
  }),
  analyse(input) {
    const s = StudySettings.parse(input.settings);
    if (s.statedLower === null || s.statedUpper === null) throw new Error('Give the stated lower and upper limits in Setup before running the analysis');
    const used = input.rows.filter((r) => !r.excluded && has(r.value));
    const stated = { lower: s.statedLower, upper: s.statedUpper };
    const result = verifyInterval(used.map((r) => r.value!), stated, s.decimals);
    const outsidePositions = used.filter((r) => outsideStated(r.value!, stated)).map((r) => r.position);
    return { ...withRepeatedLabels(result, used), excludedCount: input.rows.length - used.length, outsidePositions, stated: { lower: s.statedLower, upper: s.statedUpper, source: s.statedSource }, caution: CAUTION, engine: engineInfo(s.seed, s.resamples) };
  },
  submissionProblems: (s) => (s.statedLower === null || s.statedUpper === null || !s.statedSource
    ? [{ path: 'settings.statedSource', message: 'Give the stated interval and its source' }] : []),
  /** The source of the stated interval is record-only: the findings show the study's as it stands (analyses/recorded-words.ts). */
  recordedWords: (results, settings) => (isObject(results.stated) ? { ...results, stated: { ...results.stated, source: settings.statedSource } } : results),
  archiveVerdict: sql`CASE WHEN (results->>'accepted')::boolean THEN 'accepted' ELSE 'failed' END`,
  report: (layout, report, results) => verifyReport(layout, report, results as VerifyFindings | null),
  keyFigures(results, unit, decimals) {
    const r = results as VerifyFindings;
    const stated = r.stated ? ` the stated ${formatNumber(r.stated.lower, decimals)} to ${withUnit(formatNumber(r.stated.upper, decimals), unit)}` : ' the stated interval';
    return [`${r.outside} of ${r.n} local values outside${stated} (at most ${r.allowedOutside} allowed): ${r.accepted ? 'accepted' : 'not accepted'}`];
  },
  resultsSheet: {
    level: () => 0.95,
    columns: valueColumns,
    lines: (results, unit, decimals) => verifyLines(results as Parameters<typeof verifyLines>[0], unit, decimals),
  },
};
