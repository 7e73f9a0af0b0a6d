import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Study } from '@shared/schemas';
import { ZonedPipe, labZone } from '../../ui/lab-time';

/** The note the technologist sent with the submission, near the top of the review page; nothing without one. */
@Component({
  selector: 'app-submission-note',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ZonedPipe],
  template: `
    @if (note(); as n) {
      <aside class="note" aria-labelledby="submission-note-title" data-testid="submission-note">
        <mat-icon aria-hidden="true">sticky_note_2</mat-icon>
        <div>
          <p class="from" id="submission-note-title">
            <strong data-testid="submission-note-from">Note from {{ n.by.name }}</strong>
            @if (n.at) { <span class="muted"> · submitted {{ n.at | zoned: zone() }}</span> }
          </p>
          <p class="text" data-testid="submission-note-text">{{ n.text }}</p>
        </div>
      </aside>
    }
  `,
  styles: `
    .note {
      display: flex; gap: 12px; align-items: flex-start; margin: 16px 0; padding: 12px 16px;
      border-left: 4px solid var(--mat-sys-primary); border-radius: 4px;
      background: var(--mat-sys-surface-container); break-inside: avoid;
    }
    p { margin: 0; }
    .text { margin-top: 4px; white-space: pre-line; overflow-wrap: anywhere; }
  `,
})
export class SubmissionNote {
  readonly note = input.required<Study['submissionNote']>();
  protected readonly zone = labZone();
}
