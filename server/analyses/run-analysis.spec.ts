import { StudySettings } from '../../shared/schemas';
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
