import { Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { Observable, tap } from 'rxjs';
import type { StudyPlan } from '@shared/schemas';
import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { ApiError } from '../../../../../core/http/api-error';
import { AnalysisStore, isWorking } from '../../../findings/analysis-store';
import { PlanApi } from './plan-api';

interface PlanState {
  plan: StudyPlan | null;
  loading: boolean;
  error: string | null;
}

/**
 * The plan of the comparison on screen: what GET /studies/:id/plan answers, and its latest run followed while it is
 * queued or running. A run is an analysis (purpose 'plan'), so it is followed as the Findings tab follows one (its own
 * AnalysisStore, given by the panel: pushed progress, polling as the fallback); when it ends, the plan is read again
 * for whether the run is current.
 */
@Injectable()
export class PlanStore {
  private readonly api = inject(PlanApi);
  private readonly runs = inject(AnalysisStore);
  private readonly state = signal<PlanState>({ plan: null, loading: false, error: null });
  /** The last request made: only its answer is shown, so an older read never hides a run just queued. */
  private asked = 0;

  readonly plan = computed(() => this.state().plan);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error ?? this.runs.error());
  /** The latest run: as followed (its progress) while it is the plan's latest, else as the plan says. */
  readonly run = computed(() => {
    const latest = this.plan()?.latest ?? null;
    const followed = this.runs.analysis();
    return latest && followed?.id === latest.id ? followed : latest;
  });
  readonly working = computed(() => isWorking(this.run()));
  readonly results = computed(() => {
    const run = this.run();
    return run?.state === 'done' ? (run.results as ComparisonPlanResult | null) : null;
  });
  /** The figures were made from another plan than the one set now (read once the plan knows of the run's end). */
  readonly outOfDate = computed(() => {
    const plan = this.plan();
    return !!plan?.latest && plan.latest.state === 'done' && plan.latest.id === this.run()?.id && !plan.current;
  });

  constructor() {
    // The followed run ended while the plan still holds it as queued or running: read the plan again.
    effect(() => {
      const followed = this.runs.analysis();
      untracked(() => {
        const latest = this.plan()?.latest;
        if (followed && latest && followed.id === latest.id && isWorking(latest) && !isWorking(followed)) this.load(followed.studyId);
      });
    });
  }

  load(studyId: number): void {
    const ask = ++this.asked;
    this.state.update((s) => ({ ...s, loading: true, error: null }));
    this.api.get(studyId).subscribe({
      next: (plan) => this.show(plan, ask),
      error: (err: ApiError) => ask === this.asked && this.state.update((s) => ({ ...s, loading: false, error: err.message })),
    });
  }

  /** Queues a run of the plan as saved; the caller shows a refusal (400 with issues) at its fields. */
  start(studyId: number): Observable<StudyPlan> {
    const ask = ++this.asked;
    this.state.update((s) => ({ ...s, loading: false, error: null }));
    return this.api.run(studyId).pipe(tap((plan) => this.show(plan, ask)));
  }

  private show(plan: StudyPlan, ask: number): void {
    if (ask !== this.asked) return;
    this.state.set({ plan, loading: false, error: null });
    if (plan.latest && isWorking(plan.latest)) this.runs.follow(plan.latest.id);
  }
}
