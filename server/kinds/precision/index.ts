import { sql } from 'drizzle-orm';
import { PRECISION_RULES, precisionMeta, PrecisionSettings } from '@shared/kinds/precision/meta';
import { parseKindSettings, type KindSettings } from '@shared/kinds/settings';
import { analyzePrecision } from '@shared/stats/analyze-precision';
import type { PrecisionRow } from '@shared/stats/precision-types';
import type { ServerKind } from '../kind';
import { PRECISION_DEMOS } from './demo';
import { precisionReport } from './report';
import { precisionSheet } from './results-sheet';
import { materialSummary, overallSentence, precisionFormat } from '@shared/kinds/precision/words';
import type { PrecisionResult } from '@shared/stats/precision-types';

export const PRECISION_OUTLIER_RULE = PRECISION_RULES.outlierRule;

/** Precision verification on the server: days × replicates per material against the manufacturer's claims (CLSI EP15 practice). */
export const precisionKind: ServerKind = {
  meta: precisionMeta,
  initialSettings: () => ({
    confidenceLevel: 0.95,
    ...PRECISION_RULES,
  }),
  analyse(input) {
    const s = parseKindSettings(input.kind, input.settings) as KindSettings & PrecisionSettings;
    if (!s.materials.length) throw new Error('Name the materials and their claims in Setup before running the analysis');
    const rows: PrecisionRow[] = input.rows.filter((r) => r.value !== null).map((r) => ({
      material: String(r.extra?.material ?? ''), day: String(r.extra?.day ?? ''),
      replicate: typeof r.extra?.replicate === 'number' ? r.extra.replicate : null, value: r.value!,
      excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined, position: r.position,
    }));
    return analyzePrecision(rows, {
      materials: s.materials, days: s.days, replicates: s.replicates, alpha: s.alpha, decimals: s.decimals, seed: s.seed,
    });
  },
  submissionProblems(s) {
    const own = PrecisionSettings.safeParse(s);
    if (!own.success || !own.data.materials.length) return [{ path: 'settings.materials', message: 'Name at least one material with its repeatability and within-laboratory claims' }];
    return [];
  },
  // Verified when no repeatability or within-laboratory SD lies above its upper verification limit.
  archiveVerdict: sql`CASE
      WHEN results->'materials' @> '[{"verdicts":{"repeatability":"not-verified"}}]' OR results->'materials' @> '[{"verdicts":{"withinLab":"not-verified"}}]' THEN 'claims-not-verified'
      WHEN jsonb_array_length(COALESCE(results->'materials', '[]'::jsonb)) > 0 THEN 'claims-verified'
      ELSE NULL END`,
  report: (layout, report, results) => precisionReport(layout, report, results as never),
  keyFigures(results, unit, decimals) {
    const r = results as PrecisionResult;
    const f = precisionFormat(unit, decimals);
    return [overallSentence(r), ...(r.materials ?? []).map((m) => `${m.name}: ${materialSummary(m, f)}`)];
  },
  resultsSheet: precisionSheet,
  demos: PRECISION_DEMOS,
};
