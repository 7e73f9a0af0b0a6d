import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { catchError, map, of, startWith } from 'rxjs';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS, type Release, type StudyKind, type StudySummary } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { DialogSend } from '../../signoff/dialogs/dialog-send';
import { StudiesApi } from '../../studies/api/studies-api';
import { ReleaseApi } from '../release-api';
import { kindsWords } from '../release-words';

export interface LinkStudyData {
  releaseId: number;
  analyte: { id: number; name: string };
  requirement: { key: string; label: string; kinds: readonly StudyKind[] };
  /** Studies already linked to the release (not offered again). */
  linkedIds: readonly number[];
}

interface Candidates {
  items: StudySummary[];
  loading: boolean;
  error: string | null;
}

/** Links an existing study of the release's analyte, of a kind the requirement takes, to the requirement. */
@Component({
  selector: 'app-link-study-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatIconModule, MatProgressBarModule, MatRadioModule, ErrorBanner],
  template: `
    <h2 mat-dialog-title>Link a study to “{{ data.requirement.label }}”</h2>
    <mat-dialog-content>
      <p class="muted">{{ data.analyte.name }} studies of the kind it takes ({{ kinds }}), newest first. A signed one meets it; a draft is shown as in progress.</p>
      <app-error-banner [message]="sender.problem() ?? candidates().error" />
      @if (candidates().loading) { <mat-progress-bar mode="indeterminate" aria-label="Reading the studies" /> }
      <form [formGroup]="form" (ngSubmit)="send()" id="link-study-form">
        <mat-radio-group formControlName="studyId" class="choices" aria-label="Study to link" data-testid="link-choices">
          @for (s of candidates().items; track s.id) {
            <mat-radio-button [value]="s.id" [attr.data-testid]="'link-study-' + s.id">
              <span class="choice">
                <strong>{{ s.title }}</strong>
                <span class="muted small">Study {{ s.id }} · {{ kindLabel(s) }} · {{ s.instruments }} · n = {{ s.n }} · {{ stateLabel(s) }}</span>
              </span>
            </mat-radio-button>
          } @empty {
            @if (!candidates().loading) { <p class="muted" data-testid="link-none">No {{ data.analyte.name }} study of this kind is free to link. Start one instead.</p> }
          }
        </mat-radio-group>
        @if (form.controls.studyId.touched && form.controls.studyId.hasError('required')) {
          <p class="field-error" role="alert" data-testid="link-error">Choose a study to link.</p>
        }
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="link-study-form" [disabled]="sender.busy()" data-testid="link-confirm">
        <mat-icon>link</mat-icon> Link the study
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .choices { display: flex; flex-direction: column; gap: 4px; }
    .choice { display: flex; flex-direction: column; }
    .small { font: var(--mat-sys-body-small); }
  `,
})
export class LinkStudyDialog {
  protected readonly data = inject<LinkStudyData>(MAT_DIALOG_DATA);
  private readonly api = inject(ReleaseApi);
  protected readonly sender = new DialogSend<Release>(inject<MatDialogRef<LinkStudyDialog, Release>>(MatDialogRef));
  protected readonly kinds = kindsWords(this.data.requirement.kinds);
  protected readonly kindLabel = (s: StudySummary): string => STUDY_KIND_LABELS[s.kind] ?? s.kind;
  protected readonly stateLabel = (s: StudySummary): string => STUDY_STATE_LABELS[s.state] ?? s.state;
  protected readonly form = new FormGroup({ studyId: new FormControl<number | null>(null, [Validators.required]) });

  private readonly loaded = toSignal(
    inject(StudiesApi)
      .list({
        analyteId: this.data.analyte.id,
        ...(this.data.requirement.kinds.length === 1 ? { kind: this.data.requirement.kinds[0] } : {}),
        sort: 'updatedAt', order: 'desc', pageSize: 200,
      })
      .pipe(
        map((page): Candidates => ({ items: page.items, loading: false, error: null })),
        catchError((err: ApiError) => of<Candidates>({ items: [], loading: false, error: `The studies could not be read: ${err.message}` })),
        startWith<Candidates>({ items: [], loading: true, error: null }),
      ),
    { initialValue: { items: [], loading: true, error: null } as Candidates },
  );
  /** Studies of a kind the requirement takes, not superseded, not linked already. */
  protected readonly candidates = computed<Candidates>(() => {
    const { items, loading, error } = this.loaded();
    const kinds = this.data.requirement.kinds;
    return { loading, error, items: items.filter((s) => kinds.includes(s.kind) && !s.superseded && !this.data.linkedIds.includes(s.id)) };
  });

  protected send(): void {
    const studyId = this.form.controls.studyId.value;
    this.sender.send(this.form, () => this.api.link(this.data.releaseId, { requirement: this.data.requirement.key, studyId: studyId! }));
  }
}
