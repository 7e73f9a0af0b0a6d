import { TestBed } from '@angular/core/testing';
import { of, throwError } from 'rxjs';
import type { Analysis } from '../../../../../shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { AnalysesApi } from '../api/analyses-api';
import { AnalysisStore, POLL_MS } from './analysis-store';

const analysis = (state: Analysis['state'], progress: number): Analysis => ({
  id: 7, studyId: 1, state, progress, engineVersion: 'e', seed: 's', resamples: 1000, inputHash: 'h', current: true,
  results: state === 'done' ? { kind: 'comparison' } : null, error: null, queuedAt: '2026-01-01T00:00:00Z',
  startedAt: null, finishedAt: null, durationMs: null,
});

describe('AnalysisStore', () => {
  let answers: Analysis[];
  let gets: number;
  let store: AnalysisStore;

  beforeEach(() => {
    jest.useFakeTimers();
    gets = 0;
    answers = [analysis('running', 0.2), analysis('running', 0.6), analysis('done', 1)];
    const api: Partial<AnalysesApi> = {
      run: () => of(analysis('queued', 0)),
      get: () => of(answers[Math.min(gets++, answers.length - 1)]),
    };
    TestBed.configureTestingModule({ providers: [AnalysisStore, { provide: AnalysesApi, useValue: api }] });
    store = TestBed.inject(AnalysisStore);
  });

  afterEach(() => jest.useRealTimers());

  it('queues an analysis, asks for its progress every half second, and stops once it is done', () => {
    store.run(1);
    expect(store.analysis()?.state).toBe('queued');
    expect(store.working()).toBe(true);
    jest.advanceTimersByTime(0);
    expect(store.analysis()?.progress).toBe(0.2);
    jest.advanceTimersByTime(POLL_MS);
    expect(store.analysis()?.progress).toBe(0.6);
    jest.advanceTimersByTime(POLL_MS);
    expect(store.analysis()?.state).toBe('done');
    expect(store.working()).toBe(false);
    jest.advanceTimersByTime(POLL_MS * 10);
    expect(gets).toBe(3);
  });

  it('says why when the analysis cannot be queued', () => {
    const api = TestBed.inject(AnalysesApi);
    api.run = () => throwError(() => new ApiError(400, 'Enter at least 3 complete pairs before running the analysis.'));
    store.run(1);
    expect(store.error()).toBe('Enter at least 3 complete pairs before running the analysis.');
    expect(store.working()).toBe(false);
  });
});
