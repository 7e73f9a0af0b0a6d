import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Observable, map, of, startWith, switchMap, tap } from 'rxjs';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import { SamplePlan as SamplePlanSchema } from '@shared/kinds/method-comparison/sample-plan';
import type { Study } from '@shared/schemas';
import { ApiError } from '../../../../../core/http/api-error';
import { showIssues } from '../../../../../core/http/form-errors';
import { ErrorBanner } from '../../../../../ui/error-banner';
import { FieldErrorPipe } from '../../../../../ui/field-error';
import { schemaIssues } from '../../../../../ui/schema-rule';
import { ActionBanner } from '../../../action-banner';
import { AnalysisStore } from '../../../findings/analysis-store';
import { runStateText } from '../../../findings/findings-tab/run-state';
import type { SetupGroup } from '../../../setup/setup-form-group';
import { STUDY_CONFLICT_TEXT, StudyStore } from '../../../study/study-store';
import { fromSetup } from './from-setup';
import { PlanFigures } from './plan-figures';
import { buildPlanForm, planBody, planValues, samePlan, usesRange } from './plan-form';
import { FIELD, fillEmpty, followModel, imprecisionLabel, suggestionsOf, suggestionText, type Side, type Suggestion } from './plan-imprecision';
import { placeRefusal } from './plan-refusal';
import { PlanStore } from './plan-store';
import { issuePlace } from './plan-words';


/**
 * The plan of a method comparison before any specimen is drawn (on its Setup): the imprecision of each method, the
 * range and shape of the specimens' values and the numbers of specimens to try; the regression, decision levels and
 * allowable bias come from Setup. "Save and run plan" saves the plan with the study (PATCH, with the reason an approved
 * plan needs), queues a run, follows its progress, then shows the figures. Read-only outside a draft or for a reader.
 */
@Component({
  selector: 'app-plan-panel',
  templateUrl: './plan-panel.html',
  styleUrl: './plan-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [AnalysisStore, PlanStore, { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  imports: [
    ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule,
    ErrorBanner, FieldErrorPipe, ActionBanner, PlanFigures,
  ],
})
export class PlanPanel {
  /** The Setup form (to know whether Setup holds unsaved changes, and to mark its fields a refusal names). */
  readonly form = input.required<SetupGroup>();
  /** The study (null for a new one, which has nothing to plan from yet). */
  readonly study = input<Study | null>(null);
  readonly readonly = input(false);

  protected readonly store = inject(PlanStore);
  private readonly studies = inject(StudyStore, { optional: true });
  protected readonly planForm = buildPlanForm(planValues(null));
  /** The server's words when it asks why an approved plan changes; the reason field shows while they stand. */
  protected readonly reasonAsked = signal<string | null>(null);
  protected readonly reason = new FormControl('', {
    nonNullable: true,
    validators: [Validators.maxLength(500), (c) => (this.reasonAsked() && !String(c.value).trim() ? { server: this.reasonAsked() } : null)],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly conflictText = STUDY_CONFLICT_TEXT;
  private readonly now = signal(Date.now());
  /** The study's version after this panel saved the plan (the run queued next answers for it). */
  private ownVersion: number | undefined;

  private readonly studyId = computed(() => this.study()?.id);
  private readonly studyVersion = computed(() => this.study()?.version);
  protected readonly saved = computed(() => (this.study()?.settings as { samplePlan?: SamplePlan | null } | undefined)?.samplePlan ?? null, { equal: samePlan });
  protected readonly unit = computed(() => this.study()?.settings.unit || this.study()?.analyteUnit || '');
  protected readonly setup = computed(() => (this.study() ? fromSetup(this.study()!) : []));
  private readonly values = toSignal(this.planForm.valueChanges.pipe(map(() => this.planForm.getRawValue()), startWith(this.planForm.getRawValue())), {
    initialValue: this.planForm.getRawValue(),
  });
  protected readonly model = computed(() => this.values().errorModel);
  protected readonly range = computed(() => usesRange(this.values().shape));
  protected readonly earlier = computed(() => this.store.plan()?.earlierStudies ?? []);
  protected readonly setupDirty = toSignal(
    toObservable(this.form).pipe(switchMap((f): Observable<boolean> => (f ? f.events.pipe(map(() => f.dirty), startWith(f.dirty)) : of(false)))),
    { initialValue: false },
  );
  private readonly planDirty = toSignal(this.planForm.events.pipe(map(() => this.planForm.dirty)), { initialValue: false });
  protected readonly editable = computed(() => !this.readonly() && this.study()?.state === 'draft');
  protected readonly canRun = computed(() => this.editable() && !this.busy() && !this.store.working() && !this.setupDirty() && !(this.studies?.conflict() ?? false));
  protected readonly runText = computed(() => (this.store.run() ? runStateText(this.store.run()!, this.now()) : ''));
  protected readonly failure = computed(() => {
    const run = this.store.run();
    return run?.state === 'failed' ? `The plan run failed: ${run.error ?? 'the engine gave no reason'}. Check the plan and Setup, then run it again.` : null;
  });
  /** What keeps the saved plan from running (each in words), while the fields hold the saved plan. */
  protected readonly problems = computed(() => {
    const plan = this.store.plan();
    if (!plan || !this.saved() || this.planDirty() || this.store.working()) return [];
    return plan.problems.map((p) => {
      const place = issuePlace(p, []);
      return 'setup' in place ? place.setup : p.message;
    });
  });
  protected readonly suggestions = computed(() => suggestionsOf(this.store.plan()?.imprecision, this.model()));

  constructor() {
    // The fields follow the saved plan while they hold nothing unsaved (after loading, saving or a reload).
    effect(() => {
      const saved = this.saved();
      untracked(() => {
        if (this.planForm.dirty) return;
        this.planForm.reset(planValues(saved));
        this.fillFromSuggestions();
      });
    });
    // The plan is read for each version of the study, so a change saved on Setup shows the figures as out of date; the
    // version its own save made is followed by the run's answer instead.
    effect(() => {
      const id = this.studyId();
      const version = this.studyVersion();
      untracked(() => {
        if (id !== undefined && version !== this.ownVersion) this.store.load(id);
      });
    });
    effect(() => {
      if (this.editable()) this.planForm.enable({ emitEvent: false });
      else this.planForm.disable({ emitEvent: false });
    });
    // A plan not yet set starts from what signed precision studies found.
    effect(() => {
      this.store.plan();
      untracked(() => this.fillFromSuggestions());
    });
    // A suggested value follows the error model (CV in %, SD in the unit); a typed one stays.
    let before = this.planForm.controls.errorModel.value;
    const sub = this.planForm.controls.errorModel.valueChanges.subscribe((model) => {
      followModel(this.planForm, this.store.plan()?.imprecision, before, model);
      before = model;
    });
    const tick = setInterval(() => this.store.working() && this.now.set(Date.now()), 1000);
    inject(DestroyRef).onDestroy(() => {
      sub.unsubscribe();
      clearInterval(tick);
    });
  }

  /** Fills an empty imprecision field of a plan not yet set with what a signed precision study found. */
  private fillFromSuggestions(): void {
    const found = this.store.plan()?.imprecision;
    if (found && !this.saved() && this.editable()) fillEmpty(this.planForm, found);
  }

  protected imprecisionLabel(side: Side): string {
    return imprecisionLabel(this.study(), side, this.model(), this.unit());
  }

  protected suggestionText(x: Suggestion): string {
    return suggestionText(x, this.model(), this.unit());
  }

  protected isSuggested(side: Side): boolean {
    const x = this.suggestions().find((s) => s.side === side);
    return !!x && this.values()[FIELD[side]] === x.value;
  }

  protected useSuggestion(side: Side, value: number): void {
    const control = this.planForm.controls[FIELD[side]];
    control.setValue(value);
    control.markAsDirty();
  }

  /** Saves the plan (when it changed) with the study's version, then queues its run; a refusal shows at the field it names. */
  protected saveAndRun(): void {
    const study = this.study();
    if (!study || !this.canRun()) return;
    this.problem.set(null);
    // What the server said last time goes; the fields' own rules are checked afresh.
    for (const control of Object.values(this.planForm.controls)) control.updateValueAndValidity({ emitEvent: false });
    this.planForm.markAllAsTouched();
    const check = 'Check the marked fields of the plan.';
    if (this.planForm.invalid) {
      this.problem.set(check);
      return;
    }
    const plan = planBody(this.planForm.getRawValue());
    const issues = schemaIssues(SamplePlanSchema, plan);
    if (issues.length > 0) {
      this.problem.set(showIssues(this.planForm, check, issues));
      return;
    }
    this.busy.set(true);
    const reason = this.reason.value.trim();
    const save: Observable<unknown> = samePlan(this.saved(), plan) || !this.studies
      ? of(null)
      : this.studies.save({ settings: { samplePlan: plan }, ...(reason ? { reason } : {}) }).pipe(tap((saved) => (this.ownVersion = saved.version)));
    save.pipe(switchMap(() => {
      this.planForm.markAsPristine();
      this.reasonAsked.set(null);
      this.reason.setValue('');
      return this.store.start(study.id);
    })).subscribe({
      next: () => this.busy.set(false),
      error: (err: ApiError) => {
        this.busy.set(false);
        this.showRefusal(err);
      },
    });
  }

  /** A refusal: each issue at the plan's field it names, the reason asked for, or in words for a Setup field (marked there too). */
  private showRefusal(err: ApiError): void {
    if (err.status === 409) {
      this.problem.set(STUDY_CONFLICT_TEXT);
      return;
    }
    const placed = placeRefusal(this.planForm, err.message, err.issues);
    if (placed.reasonAsked) {
      this.reasonAsked.set(placed.reasonAsked);
      this.reason.updateValueAndValidity();
      this.reason.markAsTouched();
    }
    if (placed.setupIssues.length) showIssues(this.form(), '', placed.setupIssues);
    this.problem.set(placed.banner);
  }
}
