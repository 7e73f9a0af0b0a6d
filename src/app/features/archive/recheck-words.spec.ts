import type { IntegrityReport, ReproduceReport } from '@shared/schemas';
import { chainOutcome, engineLine, integrityOutcome, reproduceOutcome, showValue } from './recheck-words';

const integrity = (passes: boolean[]): IntegrityReport => ({
  studyId: 1, passed: passes.every(Boolean), checkedAt: '2026-03-01T10:00:00Z',
  checks: passes.map((passed, i) => ({ name: `Check ${i}`, passed, detail: '' })),
});

const reproduce = (over: Partial<ReproduceReport> = {}): ReproduceReport => ({
  studyId: 1, analysisId: 2, identical: true, storedEngine: 'parallax-stats 1.0.0', currentEngine: 'parallax-stats 1.0.0', sameEngine: true,
  fieldsCompared: 1234, differences: [], summary: '', ...over,
});

describe('chainOutcome', () => {
  const chains = (lab: boolean, system: boolean) => ({
    passed: lab && system, checkedAt: '2026-03-01T10:00:00Z',
    checks: [{ name: 'Laboratory history', passed: lab, detail: '' }, { name: 'History without a laboratory', passed: system, detail: '' }],
  });
  it('says both chains are intact only when both passed', () => {
    expect(chainOutcome(chains(true, true))).toMatchObject({ passed: true, headline: 'Both history chains are intact: no event was changed, removed or inserted.' });
    expect(chainOutcome(chains(false, true))).toMatchObject({ passed: false, headline: 'One history chain is broken: the history was changed outside Parallax.' });
    expect(chainOutcome(chains(false, false)).headline).toBe('Both history chains are broken: the history was changed outside Parallax.');
  });
});

describe('integrityOutcome', () => {
  it('says in words that every check passed', () => {
    expect(integrityOutcome(integrity([true, true, true, true]))).toEqual({
      passed: true, icon: 'verified', word: 'Passed', headline: 'All 4 checks passed: nothing changed since signing.',
    });
  });

  it('counts the failed checks and says the record no longer matches', () => {
    const o = integrityOutcome(integrity([true, false, true, false]));
    expect(o).toMatchObject({ passed: false, word: 'Failed', icon: 'report' });
    expect(o.headline).toBe('2 of 4 checks failed: the stored record no longer matches what was signed.');
  });

  it('never reads a report the server marked failed as a pass', () => {
    expect(integrityOutcome({ ...integrity([true]), passed: false }).passed).toBe(false);
  });
});

describe('reproduceOutcome', () => {
  it('says identical results with the number of fields compared', () => {
    expect(reproduceOutcome(reproduce()).headline).toBe('Re-running the analysis gave identical results in all 1,234 result fields.');
  });

  it('counts the fields that differ', () => {
    const o = reproduceOutcome(reproduce({ identical: false, differences: [{ path: 'a', stored: 1, recomputed: 2 }] }));
    expect(o).toMatchObject({ passed: false, word: 'Failed' });
    expect(o.headline).toBe('Re-running the analysis gave different values in 1 of 1,234 result fields.');
  });
});

describe('engineLine', () => {
  it('names both engine versions when they differ', () => {
    expect(engineLine(reproduce({ sameEngine: false, storedEngine: 'e 1', currentEngine: 'e 2' }))).toBe('Stored with engine e 1; re-run with e 2, a different version.');
    expect(engineLine(reproduce())).toBe('Stored and re-run with the same engine version, parallax-stats 1.0.0.');
  });
});

describe('showValue', () => {
  it('shows absent, empty and structured values plainly', () => {
    expect([undefined, null, '', true, 1.25, 'x', [1, 2], { a: 1 }].map(showValue)).toEqual([
      '(absent)', '(none)', '(empty)', 'yes', '1.25', 'x', '[1,2]', '{"a":1}',
    ]);
  });
});
