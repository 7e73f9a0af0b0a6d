import { ChangeDetectionStrategy, Component, Type, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { NgComponentOutlet } from '@angular/common';
import { catchError, of } from 'rxjs';
import type { Study } from '@shared/schemas';
import { CreateStudyBody, STUDY_KIND_LABELS, UpdateStudyBody } from '@shared/schemas';
import type { DecimalMark } from '@shared/schemas/result-text';
import { ApiError } from '../../../core/http/api-error';
import { showApiError, showIssues } from '../../../core/http/form-errors';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { schemaIssues } from '../../../ui/schema-rule';
import { ActionBanner } from '../action-banner';
import { StudiesApi } from '../api/studies-api';
import { StudyCatalog, StudyCatalogApi } from '../api/catalog-api';
import { SUPPORTED_KINDS, hasKindView, kindView } from '../kinds';
import { STUDY_CONFLICT_TEXT, StudyStore } from '../study/study-store';
import { INTERVAL_LABELS } from '../study-text';
import { buildSetupForm, readSetup, resetSetupForm } from './setup-form-group';
import { createBody, randomSeed, settingsFromAnalyte, setupValues, updateBody } from './setup-model';

/** The choices of settings.decimalMark, in words: how a comma and a point in a result are read. */
const DECIMAL_MARK_LABELS: Record<DecimalMark, string> = {
  auto: 'Detect (refuse unclear values)',
  point: 'Point (comma separates thousands)',
  comma: 'Comma (point separates thousands)',
};

/**
 * The Setup form of a study (or of a new one when `study` is null): what is compared, the goals,
 * the analysis settings and the plan. The kind of study adds its own fields (its view in kinds/).
 */
@Component({
  selector: 'app-setup-form',
  templateUrl: './setup-form.html',
  styleUrl: './setup-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // Hints of two lines (the Deming convention, the bias source) get the room they need.
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule,
    NgComponentOutlet, ErrorBanner, FieldErrorPipe, ActionBanner,
  ],
})
export class SetupForm {
  readonly study = input<Study | null>(null);
  readonly readonly = input(false);
  readonly created = output<Study>();

  private readonly api = inject(StudiesApi);
  private readonly store = inject(StudyStore, { optional: true });
  private readonly notices = inject(Notices);
  protected readonly catalog = toSignal(
    inject(StudyCatalogApi).catalog().pipe(catchError(() => of<StudyCatalog>({ analytes: [], instruments: [] }))),
  );
  protected readonly form = buildSetupForm(setupValues(null, randomSeed()));
  protected readonly problem = signal<string | null>(null);
  /**
   * The server's words when it asks why an approved plan changes. The reason field shows while they stand, and its own
   * rule says them (an error put on the field would be cleared as the field appears and binds its control).
   */
  protected readonly reasonAsked = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly conflict = computed(() => this.store?.conflict() ?? false);
  protected readonly conflictText = STUDY_CONFLICT_TEXT;
  protected readonly kinds = SUPPORTED_KINDS.map((kind) => ({ kind, label: STUDY_KIND_LABELS[kind] }));
  protected readonly intervals = Object.entries(INTERVAL_LABELS);
  protected readonly decimalMarks = Object.entries(DECIMAL_MARK_LABELS);
  protected readonly levels = [0.9, 0.95, 0.99];
  private readonly kind = toSignal(this.form.controls.kind.valueChanges, { initialValue: this.form.controls.kind.value });
  protected readonly kindFields = computed(() => kindView(this.kind()).setupFields);
  /** The kind's panel under the form (its plan before data), once loaded; none for a kind without one. */
  private readonly loadedPanel = signal<{ kind: string; component: Type<unknown> } | null>(null);
  protected readonly kindPanel = computed(() => {
    const loaded = this.loadedPanel();
    return loaded && loaded.kind === this.kind() ? loaded.component : null;
  });
  /** The kind's words for the analyte and the plan, and which analysis settings its engine reads. */
  protected readonly guidance = computed(() => kindView(this.kind()).guidance);
  protected readonly activeAnalytes = computed(() =>
    (this.catalog()?.analytes ?? []).filter((a) => a.active || a.id === this.study()?.analyte.id),
  );

  constructor() {
    this.form.controls.reason.addValidators((c) => (this.reasonAsked() && !String(c.value).trim() ? { server: this.reasonAsked() } : null));
    effect(() => {
      const kind = this.kind();
      const load = kindView(kind).setupPanel;
      if (load) void load().then((component) => this.kind() === kind && this.loadedPanel.set({ kind, component }));
    });
    effect(() => {
      const study = this.study();
      untracked(() => {
        if (study && !this.form.dirty) {
          resetSetupForm(this.form, setupValues(study, study.settings.seed), hasKindView(study.kind) ? kindView(study.kind).settingsControls : undefined);
        }
      });
    });
    effect(() => {
      if (this.readonly()) this.form.disable({ emitEvent: false });
      else this.form.enable({ emitEvent: false });
      if (this.study()) this.form.controls.kind.disable({ emitEvent: false });
    });
  }

  /** True when the form holds changes that are not saved. */
  hasUnsavedChanges(): boolean {
    return this.form.dirty && !this.readonly();
  }

  /** The user picked an analyte: its unit, decision levels and allowable bias come into the settings. */
  protected chooseAnalyte(id: number): void {
    const analyte = this.catalog()?.analytes.find((a) => a.id === id);
    if (analyte) this.form.controls.settings.patchValue(settingsFromAnalyte(analyte));
  }

  protected newSeed(): void {
    this.form.controls.settings.controls.seed.setValue(randomSeed());
    this.form.markAsDirty();
  }

  protected reload(): void {
    const id = this.study()?.id;
    if (id === undefined || !this.store) return;
    this.form.markAsPristine();
    this.problem.set(null);
    this.reasonAsked.set(null);
    this.store.load(id);
  }

  protected save(): void {
    this.problem.set(null);
    this.form.markAllAsTouched();
    if (this.form.invalid) {
      this.problem.set('Check the marked fields.');
      return;
    }
    const values = readSetup(this.form);
    const study = this.study();
    const body = study ? { ...updateBody(values, this.form.controls.reason.value), version: study.version } : createBody(values);
    const issues = schemaIssues(study ? UpdateStudyBody : CreateStudyBody, body);
    if (issues.length > 0) {
      this.problem.set(showIssues(this.form, 'Check the marked fields.', issues));
      return;
    }
    this.busy.set(true);
    const request = study && this.store ? this.store.save(updateBody(values, this.form.controls.reason.value)) : this.api.create(body as CreateStudyBody);
    request.subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.form.markAsPristine();
        this.reasonAsked.set(null);
        this.form.controls.reason.setValue('');
        if (study) this.notices.post('Setup saved.');
        else this.created.emit(saved);
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        if (err.status === 409) return;
        const asked = err.issues.find((i) => i.path === 'reason');
        if (asked) this.reasonAsked.set(asked.message);
        this.problem.set(showApiError(this.form, err));
      },
    });
  }
}
