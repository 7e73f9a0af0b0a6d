import { precisionResult } from '@shared/kinds/precision/words-fixture';
import { verifyInterval } from '@shared/stats/verify-interval';
import { rangeStudyReport } from './reportable-range/report-fixture';
import { serverKind } from '.';

/**
 * Each kind's key figures for a release's dossier (ServerKind.keyFigures), from its own results. The method
 * comparison's are checked through the API, in the release PDF (server/releases/releases.api.spec.ts).
 */
describe('key figures of a study in a release', () => {
  it('reportable range: the engine\'s verdict sentence', () => {
    const results = rangeStudyReport().results as unknown as { verdictWords: string };
    expect(serverKind('reportable-range').keyFigures(results, 'mmol/L', 1)).toEqual([results.verdictWords]);
    expect(results.verdictWords).toMatch(/reportable range/i);
  });

  it('precision: the overall sentence, then each material\'s count and grand mean', () => {
    const lines = serverKind('precision').keyFigures(precisionResult(), 'mmol/L', 2);
    expect(lines).toHaveLength(3);
    expect(lines[0]).toMatch(/claims? .*verified|Every claim verified/);
    expect(lines[1]).toMatch(/^Level 1: \d+ results over \d+ days; grand mean [\d.]+ mmol\/L\.$/);
    expect(lines[2]).toMatch(/^Level 2: /);
  });

  it('verification of a stated interval: how many fell outside, against the rule', () => {
    const values = [3.6, 3.9, 4.0, 4.1, 4.2, 4.2, 4.3, 4.4, 4.4, 4.5, 4.6, 4.6, 4.7, 4.8, 4.9, 5.0, 5.1, 5.2, 5.3, 5.4];
    const outside = [...values.slice(0, 17), 5.6, 5.7, 5.8];
    const ok = { ...verifyInterval(values, { lower: 3.5, upper: 5.5 }, 1), stated: { lower: 3.5, upper: 5.5, source: 'insert' } };
    const bad = { ...verifyInterval(outside, { lower: 3.5, upper: 5.5 }, 1), stated: { lower: 3.5, upper: 5.5, source: 'insert' } };
    expect(serverKind('interval-verify').keyFigures(ok, 'mmol/L', 1)).toEqual(['0 of 20 local values outside the stated 3.5 to 5.5 mmol/L (at most 2 allowed): accepted']);
    expect(serverKind('interval-verify').keyFigures(bad, 'mmol/L', 1)).toEqual(['3 of 20 local values outside the stated 3.5 to 5.5 mmol/L (at most 2 allowed): not accepted']);
  });

  it('established interval: both limits with their CIs and the count', () => {
    const limit = (estimate: number, lo: number, hi: number) => ({ percentile: 2.5, estimate, ci: [lo, hi], rankCi: null, ranks: null, distribution: null });
    const lines = serverKind('interval-establish').keyFigures({ n: 240, lower: limit(45, 42, 48), upper: limit(104, 99, 110) }, 'µmol/L', 0);
    expect(lines).toEqual(['Lower limit 45 µmol/L (CI 42 to 48); upper limit 104 µmol/L (CI 99 to 110); n = 240']);
  });
});
