import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Outcome } from '../recheck-words';

/** The line a re-check result opens with: an icon and "Passed." or "Failed." before the headline, never colour alone. */
@Component({
  selector: 'app-recheck-outcome',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <p class="outcome" [class.failed]="!outcome().passed" role="status">
      <mat-icon aria-hidden="true">{{ outcome().icon }}</mat-icon>
      <span><strong>{{ outcome().word }}.</strong> {{ outcome().headline }}</span>
    </p>
  `,
  styles: `
    .outcome {
      display: flex;
      align-items: flex-start;
      gap: 8px;
      margin: 16px 0 8px;
      padding: 8px 12px;
      border-radius: 8px;
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    .outcome.failed {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
})
export class RecheckOutcome {
  readonly outcome = input.required<Outcome>();
}
