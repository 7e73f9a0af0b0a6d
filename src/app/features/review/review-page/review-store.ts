import { Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { Observable, Subject, catchError, forkJoin, map, of, switchMap } from 'rxjs';
import type { Analysis, HistoryEvent, Signature, Study } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { HistoryApi } from '../../archive/history-api';
import { AnalysesApi } from '../../studies/api/analyses-api';
import { SpecimensStore } from '../../studies/specimens/specimens-store';
import { hasKindView, kindView } from '../../studies/kinds';
import { StudyStore } from '../../studies/study/study-store';
import { SignoffApi } from '../../signoff/signoff-api';
import { analysisToShow, planApprovalOf, signOffOf } from '../../signoff/signatures';

interface ReviewState {
  /** "id:version" of the study these were read for; a new version reads them again. */
  readFor: string | null;
  signatures: Signature[];
  moved: HistoryEvent[];
  analysis: Analysis | null;
  loading: boolean;
  error: string | null;
}

const INITIAL: ReviewState = { readFor: null, signatures: [], moved: [], analysis: null, loading: false, error: null };

/**
 * What the review page reads besides the study: its signatures, the criteria moved after plan approval
 * (from the history), the analysis to show and the specimen rows. Read again whenever the study's
 * version moves (after a return or a signature).
 */
@Injectable()
export class ReviewStore {
  private readonly studies = inject(StudyStore);
  private readonly signoff = inject(SignoffApi);
  private readonly analyses = inject(AnalysesApi);
  private readonly history = inject(HistoryApi);
  private readonly specimens = inject(SpecimensStore);
  private readonly state = signal<ReviewState>(INITIAL);
  private readonly reads = new Subject<Study>();

  readonly study = this.studies.study;
  readonly studyError = this.studies.error;
  readonly signatures = computed(() => this.state().signatures);
  readonly planApproval = computed(() => planApprovalOf(this.state().signatures));
  readonly signOff = computed(() => signOffOf(this.state().signatures));
  readonly moved = computed(() => this.state().moved);
  readonly analysis = computed(() => this.state().analysis);
  readonly loading = computed(() => this.studies.loading() || this.state().loading);
  readonly error = computed(() => this.state().error);

  constructor() {
    this.reads
      .pipe(switchMap((study) => this.around(study)), takeUntilDestroyed())
      .subscribe((answer) => this.state.update((s) => ({ ...s, ...answer })));
    effect(() => {
      const study = this.study();
      if (study) untracked(() => this.readAround(study));
    });
  }

  load(id: number): void {
    this.studies.load(id);
  }

  /** Takes the study a sign-off step answered; what surrounds it is read again. */
  adopt(study: Study): void {
    this.studies.adopt(study);
  }

  private readAround(study: Study): void {
    const readFor = `${study.id}:${study.version}`;
    if (this.state().readFor === readFor) return;
    this.state.update((s) => ({ ...s, readFor, loading: true, error: null }));
    if (hasKindView(study.kind)) this.specimens.ensureLoaded(study.id, kindView(study.kind).layout);
    this.reads.next(study);
  }

  /** The signatures and history of a study, then the analysis those point to; a later read replaces an earlier one. */
  private around(study: Study): Observable<Partial<ReviewState>> {
    return forkJoin({ signatures: this.signoff.signatures(study.id), events: this.history.study(study.id) }).pipe(
      switchMap(({ signatures, events }) => {
        const id = analysisToShow(study, signatures);
        const moved = events.filter((e) => e.action === 'study.plan-amended');
        const analysis: Observable<Analysis | null> = id === null ? of(null) : this.analyses.get(id);
        return analysis.pipe(map((a): Partial<ReviewState> => ({ signatures, moved, analysis: a, loading: false })));
      }),
      catchError((err: ApiError) => of<Partial<ReviewState>>({ loading: false, error: `Part of the review could not be read: ${err.message}` })),
    );
  }
}
