import { StudySettings } from '@shared/schemas';
import type { AnalysisInput } from '../specimens/input-hash';
import { runAnalysis } from './run-analysis';

type Row = AnalysisInput['rows'][number];
const row = (position: number, comparative: number, candidate: number, excluded = false): Row => ({
  position, label: `S-${position}`, comparative, candidate, value: null,
  comparativeText: String(comparative), candidateText: String(candidate), valueText: null,
  sex: null, ageBand: null, excluded, exclusionReason: excluded ? 'haemolysed' : null,
});
const settings = (decimals: number) => ({ ...StudySettings.parse({}), decimals, resamples: 1000, regressionResamples: 1000 });
const comparison = (rows: Row[], decimals = 0): AnalysisInput => ({ kind: 'method-comparison', settings: settings(decimals), rows });
const sodium = (): Row[] => Array.from({ length: 40 }, (_, i) => row(i + 3, 130 + (i % 20), 131 + (i % 20) - (i % 9 === 0 ? 1 : 0)));

describe('runAnalysis and the engine 1.2 contract', () => {
  it('passes the analyte decimals on, so the result says its step came from the analyte', () => {
    const result = runAnalysis(comparison(sodium())) as { resolution: { increment: number; source: string; limitedEstimates: string[] } };
    expect(result.resolution).toMatchObject({ increment: 1, source: 'analyte' });
    expect(result.resolution.limitedEstimates).toContain('bias.median');
  });

  it('refuses a result beyond the engine’s range naming the grid row and field, excluded rows included', () => {
    const rows = sodium();
    rows[5] = row(rows[5].position, 140, 1e300);
    expect(() => runAnalysis(comparison(rows))).toThrow(`row ${rows[5].position}: the candidate result 1e+300 is outside the range the engine computes in`);
    const excluded = sodium();
    excluded[7] = row(excluded[7].position, 2e-200, 141, true);
    expect(() => runAnalysis(comparison(excluded))).toThrow(`row ${excluded[7].position}: the comparative result 2e-200 is outside`);
  });
});

describe('runAnalysis and repeated labels', () => {
  const relabel = (rows: Row[], labels: Record<number, string>): Row[] => rows.map((r, i) => (labels[i] ? { ...r, label: labels[i] } : r));
  const values = (): Row[] => Array.from({ length: 24 }, (_, i) => ({ ...row(i + 1, 0, 0), comparative: null, candidate: null, comparativeText: null, candidateText: null, value: 4 + (i % 12) * 0.1, valueText: (4 + (i % 12) * 0.1).toFixed(1) }));
  const interval = (kind: string, rows: Row[]): AnalysisInput => ({ kind, settings: { ...settings(1), statedLower: 3.5, statedUpper: 5.5, statedSource: 'invented' }, rows });
  const warning = (names: string, rows: number) =>
    `${names} more than once among the analysed rows (${rows} rows): a specimen entered twice counts twice in every estimate; check the labels, or exclude the extra rows with a reason.`;

  it('names the labels that analysed rows repeat first among the warnings of every kind of study', () => {
    const pairs = relabel(sodium(), { 1: ' s-3', 9: 'S-10', 10: 'S-10' });
    const compared = runAnalysis(comparison(pairs)) as { warnings: string[] };
    expect(compared.warnings[0]).toBe(warning('Labels S-3, S-10 appear', 5));
    for (const kind of ['interval-establish', 'interval-verify']) {
      const result = runAnalysis(interval(kind, relabel(values(), { 5: 'S-1' }))) as { warnings: string[] };
      expect(result.warnings[0]).toBe(warning('Label S-1 appears', 2));
    }
  });

  it('says nothing when an excluded row carries the repeated label', () => {
    const pairs = sodium();
    pairs[1] = { ...row(pairs[1].position, 140, 141, true), label: pairs[0].label };
    const result = runAnalysis(comparison(pairs)) as { warnings: string[] };
    expect(result.warnings.filter((w) => w.includes('more than once'))).toEqual([]);
    expect((runAnalysis(interval('interval-verify', values())) as { warnings: string[] }).warnings.filter((w) => w.includes('more than once'))).toEqual([]);
  });
});
