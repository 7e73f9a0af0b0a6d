import type { Analysis } from '@shared/schemas';

/** The line beside the progress bar: "Waiting to start · 2 s" or "Running · 45 % · 12 s". */
export function runStateText(analysis: Analysis, now: number): string {
  const since = Date.parse(analysis.startedAt ?? analysis.queuedAt);
  const seconds = Number.isNaN(since) ? 0 : Math.max(0, Math.round((now - since) / 1000));
  if (analysis.state === 'queued') return `Waiting to start · ${seconds} s`;
  if (analysis.state === 'running') return `Running · ${Math.round(analysis.progress * 100)} % · ${seconds} s`;
  if (analysis.state === 'done') return analysis.durationMs === null ? 'Done' : `Done in ${(analysis.durationMs / 1000).toFixed(1)} s`;
  return 'Failed';
}

/** The failure in words for the banner. */
export function failureText(analysis: Analysis): string {
  return `The analysis failed: ${analysis.error ?? 'the engine gave no reason'}. Check the rows and settings, then run it again.`;
}
