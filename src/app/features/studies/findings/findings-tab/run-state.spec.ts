import type { Analysis } from '@shared/schemas';
import { failureText, runStateText } from './run-state';

const base: Analysis = {
  id: 1, studyId: 1, state: 'queued', progress: 0, engineVersion: 'e', seed: 's', resamples: 1000, inputHash: 'h', current: true,
  results: null, error: null, queuedAt: '2026-03-01T10:00:00.000Z', startedAt: null, finishedAt: null, durationMs: null,
};
const at = (iso: string): number => Date.parse(iso);

describe('runStateText', () => {
  it('counts the seconds waiting since the analysis was queued', () => {
    expect(runStateText(base, at('2026-03-01T10:00:02.400Z'))).toBe('Waiting to start · 2 s');
  });

  it('shows progress and the seconds since it started while running', () => {
    const running = { ...base, state: 'running' as const, progress: 0.456, startedAt: '2026-03-01T10:00:01.000Z' };
    expect(runStateText(running, at('2026-03-01T10:00:13.000Z'))).toBe('Running · 46 % · 12 s');
  });

  it('tells how long a finished analysis took', () => {
    expect(runStateText({ ...base, state: 'done', durationMs: 8340 }, 0)).toBe('Done in 8.3 s');
  });
});

describe('failureText', () => {
  it("gives the engine's reason in words", () => {
    expect(failureText({ ...base, state: 'failed', error: 'row 3: the candidate result is empty' })).toBe(
      'The analysis failed: row 3: the candidate result is empty. Check the rows and settings, then run it again.',
    );
  });
});
