import { existsSync, readFileSync } from 'node:fs';

export interface SuiteCount { name: string; passed: number; failed: number; note?: string }

/** Counts from jest's --json output; a suite that failed to run counts as one failure. */
export function readJest(name: string, file: string): SuiteCount {
  if (!existsSync(file)) return { name, passed: 0, failed: 1, note: 'jest wrote no results' };
  const r = JSON.parse(readFileSync(file, 'utf8'));
  const brokenSuites = (r.testResults ?? []).filter((s: { status: string; assertionResults: unknown[] }) => s.status === 'failed' && s.assertionResults.length === 0).length;
  return { name, passed: r.numPassedTests, failed: r.numFailedTests + brokenSuites };
}

/** Counts from Playwright's JSON reporter. */
export function readPlaywright(name: string, file: string): SuiteCount {
  if (!existsSync(file)) return { name, passed: 0, failed: 1, note: 'Playwright wrote no results' };
  const r = JSON.parse(readFileSync(file, 'utf8'));
  const s = r.stats ?? {};
  const errors = (r.errors ?? []).length;
  return { name, passed: (s.expected ?? 0) + (s.flaky ?? 0), failed: (s.unexpected ?? 0) + errors };
}
