import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, map, of, startWith } from 'rxjs';
import {
  CHANGE_TYPE_LABELS, CreateReleaseBody, type ChangeType, type Release, type ReleaseTemplate,
} from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { schemaRule } from '../../../ui/schema-rule';
import { DialogSend } from '../../signoff/dialogs/dialog-send';
import { StudyCatalogApi } from '../../studies/api/catalog-api';
import { ReleaseApi } from '../release-api';
import { kindsWords } from '../release-words';
import { requirementArray, requirementsOf } from '../requirement-rows/requirement-form';
import { RequirementRows } from '../requirement-rows/requirement-rows';

/** What a new release may start with: from a due item, its re-verification, analyte and instrument. */
export interface CreateReleaseData {
  dueItemId?: number;
  /** The due item's words, shown so the person knows what the release answers. */
  dueLabel?: string;
  analyteId?: number;
  instrumentId?: number;
  changeType?: ChangeType;
  title?: string;
}

/**
 * A new release: the change type (its template decides the requirements, shown read-only), a title, the analyte
 * and instrument, an optional comparative instrument, the reagent lot and a note. For an other change a director
 * picks the requirements. Closes with the release the server created.
 */
@Component({
  selector: 'app-create-release-dialog',
  templateUrl: './create-release-dialog.html',
  styleUrl: './create-release-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule,
    ErrorBanner, FieldErrorPipe, RequirementRows,
  ],
})
export class CreateReleaseDialog {
  protected readonly data = inject<CreateReleaseData | null>(MAT_DIALOG_DATA, { optional: true }) ?? {};
  private readonly api = inject(ReleaseApi);
  protected readonly director = inject(AuthStore).hasAnyRole(['director']);
  protected readonly sender = new DialogSend<Release>(inject<MatDialogRef<CreateReleaseDialog, Release>>(MatDialogRef));
  protected readonly changeTypes = Object.entries(CHANGE_TYPE_LABELS) as [ChangeType, string][];

  protected readonly form = new FormGroup({
    changeType: new FormControl<ChangeType | null>(this.data.changeType ?? null, [Validators.required]),
    title: new FormControl(this.data.title ?? '', { nonNullable: true, validators: [schemaRule(CreateReleaseBody.shape.title)] }),
    analyteId: new FormControl<number | null>(this.data.analyteId ?? null, [Validators.required]),
    instrumentId: new FormControl<number | null>(this.data.instrumentId ?? null, [Validators.required]),
    comparativeInstrumentId: new FormControl<number | null>(null),
    reagentLot: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(100)] }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    requirements: requirementArray(),
  });

  private readonly catalog = toSignal(inject(StudyCatalogApi).catalog().pipe(catchError(() => of(null))), { initialValue: null });
  /** Analytes and instruments in use, and the one a due item names even when it is no longer in use. */
  protected readonly analytes = computed(() => (this.catalog()?.analytes ?? []).filter((a) => a.active || a.id === this.data.analyteId));
  protected readonly instruments = computed(() => (this.catalog()?.instruments ?? []).filter((i) => i.active || i.id === this.data.instrumentId));
  private readonly templates = toSignal(
    this.api.templates().pipe(
      map((list) => ({ list, error: null as string | null })),
      catchError(() => of({ list: [] as ReleaseTemplate[], error: 'The laboratory’s templates could not be read; the server applies them all the same.' })),
    ),
    { initialValue: { list: [] as ReleaseTemplate[], error: null } },
  );
  protected readonly templateError = computed(() => this.templates().error);
  private readonly changeType = toSignal(this.form.controls.changeType.valueChanges.pipe(startWith(this.form.controls.changeType.value)), {
    initialValue: this.form.controls.changeType.value,
  });
  protected readonly custom = computed(() => this.changeType() === 'custom');
  /** The chosen change type's template (the requirements and due rules the release takes), for every type but custom. */
  protected readonly template = computed(() => {
    const type = this.changeType();
    return type && type !== 'custom' ? (this.templates().list.find((t) => t.changeType === type) ?? null) : null;
  });
  protected readonly kindsWords = kindsWords;

  protected create(): void {
    const v = this.form.getRawValue();
    const custom = v.changeType === 'custom';
    // A technologist's other change leaves the requirements to a director (on the release page).
    if (!custom || !this.director) this.form.controls.requirements.clear();
    else if (this.form.controls.requirements.length === 0) {
      this.form.markAllAsTouched();
      this.sender.problem.set('Name at least one requirement: an other change needs the studies you pick.');
      return;
    }
    const body: CreateReleaseBody = {
      changeType: v.changeType!,
      title: v.title.trim(),
      analyteId: v.analyteId!,
      instrumentId: v.instrumentId!,
      comparativeInstrumentId: v.comparativeInstrumentId ?? null,
      reagentLot: v.reagentLot.trim(),
      note: v.note.trim(),
      ...(custom && this.director ? { requirements: requirementsOf(this.form.controls.requirements) } : {}),
      ...(this.data.dueItemId ? { dueItemId: this.data.dueItemId } : {}),
    };
    this.sender.send(this.form, () => this.api.create(body));
  }
}
