import { TestBed } from '@angular/core/testing';
import { of, throwError } from 'rxjs';
import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import type { Analysis } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { AnalysesApi } from '../api/analyses-api';
import { AnalysisStore, POLL_MS } from './analysis-store';

const analysis = (state: Analysis['state'], progress: number): Analysis => ({
  id: 7, studyId: 1, state, progress, engineVersion: 'e', seed: 's', resamples: 1000, inputHash: 'h', current: true,
  results: state === 'done' ? { kind: methodComparisonMeta.resultKind } : null, error: null, queuedAt: '2026-01-01T00:00:00Z',
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

/** A stand-in for the browser's EventSource: the test pushes events and errors by hand. */
class FakeEventSource {
  static last: FakeEventSource | null = null;
  closed = false;
  onerror: (() => void) | null = null;
  private readonly listeners: ((e: { data: string }) => void)[] = [];
  constructor(readonly url: string) {
    FakeEventSource.last = this;
  }
  addEventListener(_type: string, listener: (e: { data: string }) => void): void {
    this.listeners.push(listener);
  }
  push(state: Analysis['state'], progress: number): void {
    for (const l of this.listeners) l({ data: JSON.stringify({ id: 7, state, progress }) });
  }
  close(): void {
    this.closed = true;
  }
}

describe('AnalysisStore with pushed progress', () => {
  let gets: number;
  let answer: Analysis;
  let store: AnalysisStore;

  beforeEach(() => {
    jest.useFakeTimers();
    (globalThis as { EventSource?: unknown }).EventSource = FakeEventSource;
    FakeEventSource.last = null;
    gets = 0;
    answer = analysis('done', 1);
    const api: Partial<AnalysesApi> = {
      run: () => of(analysis('queued', 0)),
      get: () => { gets++; return of(answer); },
    };
    TestBed.configureTestingModule({ providers: [AnalysisStore, { provide: AnalysesApi, useValue: api }] });
    store = TestBed.inject(AnalysisStore);
  });

  afterEach(() => {
    delete (globalThis as { EventSource?: unknown }).EventSource;
    jest.useRealTimers();
  });

  it('shows pushed progress without asking, and reads the results once when the analysis is done', () => {
    store.run(1);
    const source = FakeEventSource.last!;
    expect(source.url).toBe('/api/v1/analyses/7/events');
    source.push('running', 0.4);
    expect(store.analysis()?.state).toBe('running');
    expect(store.analysis()?.progress).toBe(0.4);
    jest.advanceTimersByTime(POLL_MS * 10);
    expect(gets).toBe(0);
    source.push('done', 1);
    expect(gets).toBe(1);
    expect(store.analysis()?.results).toEqual({ kind: methodComparisonMeta.resultKind });
    expect(store.working()).toBe(false);
    expect(source.closed).toBe(true);
  });

  it('asks every half second instead when the server cannot push', () => {
    answer = analysis('running', 0.5);
    store.run(1);
    FakeEventSource.last!.onerror!();
    expect(FakeEventSource.last!.closed).toBe(true);
    jest.advanceTimersByTime(0);
    expect(gets).toBe(1);
    jest.advanceTimersByTime(POLL_MS * 2);
    expect(gets).toBe(3);
    answer = analysis('done', 1);
    jest.advanceTimersByTime(POLL_MS);
    expect(store.analysis()?.state).toBe('done');
    jest.advanceTimersByTime(POLL_MS * 4);
    expect(gets).toBe(4);
  });

  it('opens no stream for an analysis that has already ended', () => {
    store.follow(7);
    expect(gets).toBe(1);
    expect(FakeEventSource.last).toBeNull();
    expect(store.analysis()?.state).toBe('done');
  });
});
