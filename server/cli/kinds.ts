import { analyzeComparison, analyzeInterval, bootstrapTest, verifyInterval } from '@shared/stats';
import type { ComparisonRow, IntervalRow } from '@shared/stats';
import { CsvError, numberColumn, textColumn, type CsvTable } from './csv';
import { FlagError, integerFlag, listFlag, numberFlag, textFlag, wordsFlag, type FlagSpec } from './flags';
import type { KindMeta } from '@shared/kinds/kind';
import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { intervalVerifyMeta } from '@shared/kinds/interval-verify/meta';
import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';

/** One analysis kind of `npm run analyze -- KIND FILE.csv [options]`: its flags and how it runs. */
export interface Kind {
  flags: FlagSpec;
  run(table: CsvTable, options: Record<string, unknown>): unknown;
}

const resampling: FlagSpec = { '--resamples': ['resamples', integerFlag], '--seed': ['seed', textFlag] };

const comparison: Kind = {
  flags: {
    ...resampling,
    '--level': ['level', numberFlag], '--interval': ['interval', textFlag], '--loa-multiplier': ['loaMultiplier', numberFlag],
    '--difference': ['difference', textFlag], '--regression': ['regression', textFlag], '--deming-ratio': ['demingRatio', numberFlag],
    '--regression-resamples': ['regressionResamples', integerFlag], '--regression-ci': ['regressionCi', textFlag],
    '--decision-levels': ['decisionLevels', listFlag], '--allowable-bias': ['allowableBias', numberFlag],
    '--allowable-bias-percent': ['allowableBiasPercent', numberFlag], '--esd-alpha': ['esdAlpha', numberFlag], '--esd-max': ['esdMax', integerFlag],
    '--decimals': ['decimals', integerFlag],
  },
  run(table, options) {
    const x = numberColumn(table, 'x');
    const y = numberColumn(table, 'y');
    const labels = textColumn(table, 'specimen');
    const excluded = flagsColumn(table);
    const reasons = textColumn(table, 'reason');
    const rows: ComparisonRow[] = x.map((xi, k) => ({
      x: xi, y: y[k], label: labels?.[k] || undefined, excluded: excluded?.[k] ?? false, exclusionReason: reasons?.[k] || undefined,
    }));
    return analyzeComparison(rows, options);
  },
};

const interval: Kind = {
  flags: {
    ...resampling, '--level': ['level', numberFlag], '--method': ['method', textFlag], '--percentiles': ['percentiles', listFlag],
    '--partition-fields': ['partitionFields', wordsFlag], '--decimals': ['decimals', integerFlag],
  },
  run(table, options) {
    const values = numberColumn(table, 'value');
    const [group, sex, ageBand] = ['group', 'sex', 'ageBand'].map((c) => textColumn(table, c) ?? textColumn(table, c === 'ageBand' ? 'age_band' : c));
    const excluded = flagsColumn(table);
    const rows: IntervalRow[] = values.map((value, k) => ({
      value, group: group?.[k] || undefined, sex: sex?.[k] || undefined, ageBand: ageBand?.[k] || undefined, excluded: excluded?.[k] ?? false,
    }));
    return analyzeInterval(rows, options);
  },
};

const verify: Kind = {
  flags: { '--lower': ['lower', numberFlag], '--upper': ['upper', numberFlag], '--coverage': ['coverage', numberFlag], '--decimals': ['decimals', integerFlag] },
  run(table, options) {
    if (options.lower === undefined || options.upper === undefined) throw new FlagError(`${intervalVerifyMeta.resultKind} needs --lower L and --upper U`);
    const { n, outside, accepted, probability, ...rest } = verifyInterval(numberColumn(table, 'value'), options as { lower: number; upper: number }, options.decimals as number | undefined);
    return { n, outside, accepted, probability, ...rest };
  },
};

const test: Kind = {
  flags: { ...resampling, '--statistic': ['statistic', textFlag], '--null': ['null', numberFlag] },
  run(table, options) {
    return bootstrapTest(numberColumn(table, 'value'), options);
  },
};

/** The engine's runners by the study kind whose engine each runs (named from the registry, never spelt out here). */
const ENGINE_RUNNERS = new Map<KindMeta, Kind>([[methodComparisonMeta, comparison], [intervalEstablishMeta, interval], [intervalVerifyMeta, verify]]);

/**
 * The engine's commands, in one place: each is typed as the name of its result (KindMeta.resultKind: comparison,
 * interval, verify-interval, as the README documents them), which is not a study kind's name (the study kinds
 * run by their own names with --settings, study-kinds.ts); and the bootstrap test, which belongs to no kind.
 */
export const KINDS: Record<string, Kind> = {
  ...Object.fromEntries([...ENGINE_RUNNERS].map(([meta, kind]) => [meta.resultKind, kind])),
  'bootstrap-test': test,
};

/** Optional `excluded` column: true/false, yes/no, 1/0 or empty. */
function flagsColumn(table: CsvTable): boolean[] | undefined {
  const cells = textColumn(table, 'excluded');
  return cells?.map((c, k) => {
    const t = c.toLowerCase();
    if (['', '0', 'false', 'no', 'n'].includes(t)) return false;
    if (['1', 'true', 'yes', 'y'].includes(t)) return true;
    throw new CsvError(`row ${table.rows[k].row} (line ${table.rows[k].line}), column excluded: "${c}" is not true/false`);
  });
}
