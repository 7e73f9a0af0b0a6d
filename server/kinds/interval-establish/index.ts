import { sql } from 'drizzle-orm';
import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { StudySettings } from '@shared/schemas';
import { analyzeInterval } from '@shared/stats/analyze-interval';
import type { IntervalResult } from '@shared/stats';
import { has, toPositions, withRepeatedLabels } from '../../analyses/analysis-rows';
import { establishColumns, establishLines } from '../../audit/results-sheet';
import type { EstablishFindings } from '../../reports/report-model';
import { establishReport } from '../../reports/sections/establish-report';
import type { ServerKind } from '../kind';
import { formatNumber, withUnit } from '@shared/types/findings-numbers';

/** The outlier rule both reference-interval kinds start with. */
export const INTERVAL_OUTLIER_RULE = 'Tukey fences and Dixon\'s D/R > 1/3 rule (flags only; exclusion needs a reason)';

/** Establishing a reference interval on the server. */
export const intervalEstablishKind: ServerKind = {
  meta: intervalEstablishMeta,
  initialSettings: () => ({
    confidenceLevel: 0.9,
    acceptanceRule: 'Nonparametric limits with 90% CIs from at least 120 reference individuals per partition; partitions where Harris & Boyd recommend them',
    outlierRule: INTERVAL_OUTLIER_RULE,
  }),
  analyse(input, onProgress) {
    const s = StudySettings.parse(input.settings);
    const used = input.rows.filter((r) => has(r.value));
    const result = analyzeInterval(
      used.map((r) => ({ value: r.value!, label: r.label || undefined, sex: r.sex ?? undefined, ageBand: r.ageBand ?? undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
      { resamples: s.resamples, seed: s.seed, level: s.confidenceLevel, method: s.intervalMethod, percentiles: s.percentiles, partitionFields: s.partitionFields, decimals: s.decimals },
      onProgress,
    );
    return { ...withRepeatedLabels(result, used), outlierPositions: toPositions(result.outliers, used) };
  },
  submissionProblems: (s) => (s.populationDescription.trim()
    ? [] : [{ path: 'settings.populationDescription', message: 'Describe the reference population and the exclusion criteria used' }]),
  archiveVerdict: sql`'established'`,
  report: (layout, report, results) => establishReport(layout, report, results as EstablishFindings | null),
  keyFigures(results, unit, decimals) {
    const r = results as IntervalResult;
    const limit = (l: IntervalResult['lower']) => (l ? `${withUnit(formatNumber(l.estimate, decimals), unit)} (CI ${l.ci ? `${formatNumber(l.ci[0], decimals)} to ${formatNumber(l.ci[1], decimals)}` : 'not available'})` : 'not available');
    return [`Lower limit ${limit(r.lower)}; upper limit ${limit(r.upper)}; n = ${r.n}`];
  },
  resultsSheet: {
    level: (results) => (results as IntervalResult | null)?.settings?.level ?? 0.95,
    columns: establishColumns,
    lines: (results, unit, decimals) => establishLines(results as IntervalResult, unit, decimals),
  },
};
