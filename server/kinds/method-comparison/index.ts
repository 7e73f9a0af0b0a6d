import { sql } from 'drizzle-orm';
import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import { StudySettings } from '@shared/schemas';
import { analyzeComparison } from '@shared/stats/analyze-comparison';
import { comparisonColumns, comparisonLines } from '../../audit/results-sheet';
import type { ComparisonResult } from '@shared/stats';
import { has, toPositions, withRepeatedLabels } from '../../analyses/analysis-rows';
import type { ComparisonFindings } from '../../reports/report-model';
import { comparisonReport } from '../../reports/sections/comparison-report';
import type { ServerKind } from '../kind';
import { estimateWithCi, findingsDecimals, formatNumber, levelLabel, withUnit } from '@shared/types/findings-numbers';
import { VERDICT_WORDS } from '@shared/text/verdict-words';

/** Method comparison on the server: the engine's comparison, the goals it needs before submission, its report. */
export const methodComparisonKind: ServerKind = {
  meta: methodComparisonMeta,
  initialSettings: () => ({ confidenceLevel: 0.95 }),
  analyse(input, onProgress) {
    const s = StudySettings.parse(input.settings);
    const used = input.rows.filter((r) => has(r.comparative) && has(r.candidate));
    const result = analyzeComparison(
      used.map((r) => ({ x: r.comparative!, y: r.candidate!, label: r.label || undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
      {
        resamples: s.resamples, regressionResamples: s.regressionResamples, seed: s.seed, level: s.confidenceLevel, interval: s.interval,
        loaMultiplier: s.loaMultiplier, difference: s.differenceType, regression: s.regression, demingRatio: s.demingRatio,
        decisionLevels: s.decisionLevels, allowableBias: s.allowableBiasAbsolute ?? undefined, allowableBiasPercent: s.allowableBiasPercent ?? undefined,
        esdAlpha: s.esdAlpha, esdMax: s.esdMax ?? undefined, decimals: s.decimals,
      },
      onProgress,
    );
    return { ...withRepeatedLabels(result, used), outlierPositions: toPositions(result.outliers, used) };
  },
  submissionProblems(s) {
    const problems: { path: string; message: string }[] = [];
    if (!s.decisionLevels.length) problems.push({ path: 'settings.decisionLevels', message: 'Name at least one medical decision level' });
    if (s.allowableBiasAbsolute === null && s.allowableBiasPercent === null) problems.push({ path: 'settings.allowableBiasAbsolute', message: 'Set the allowable bias' });
    if (!s.allowableBiasSource) problems.push({ path: 'settings.allowableBiasSource', message: 'Name the source of the allowable bias' });
    return problems;
  },
  archiveVerdict: sql`CASE
      WHEN results->'decisionLevels' @> '[{"verdict":"exceeds"}]' THEN 'exceeds'
      WHEN results->'decisionLevels' @> '[{"verdict":"inconclusive"}]' THEN 'inconclusive'
      WHEN jsonb_array_length(COALESCE(results->'decisionLevels', '[]'::jsonb)) > 0 THEN 'within'
      ELSE NULL END`,
  report: (layout, report, results) => comparisonReport(layout, report, results as ComparisonFindings | null),
  keyFigures(results, unit, decimals) {
    const r = results as ComparisonResult;
    const d = findingsDecimals(decimals, r.settings?.difference);
    const units = r.settings?.difference && r.settings.difference !== 'absolute' ? '%' : unit;
    const level = levelLabel(r.settings?.level ?? 0.95);
    return [
      `Median bias ${estimateWithCi(r.bias?.median, d.difference, units)}, ${level} CI; n = ${r.n}`,
      ...(r.decisionLevels ?? []).map((l) => `Bias at ${withUnit(formatNumber(l.level, decimals), unit)}: ${estimateWithCi(l.bias, d.stat, unit)}; ${l.verdict ? VERDICT_WORDS[l.verdict].toLowerCase() : 'no allowable bias set'}`),
    ];
  },
  resultsSheet: {
    level: (results) => (results as ComparisonResult | null)?.settings?.level ?? 0.95,
    columns: comparisonColumns,
    lines: (results, unit, decimals) => comparisonLines(results as ComparisonResult, unit, decimals),
  },
};
