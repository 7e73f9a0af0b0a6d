import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CheckResult } from '@shared/schemas';

/** The checks of a re-check, one per line: an icon and "passed" or "failed" in words, then the detail. */
@Component({
  selector: 'app-check-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <ul class="checks">
      @for (check of checks(); track check.name) {
        <li [class.failed]="!check.passed" [attr.data-testid]="'check-' + check.name">
          <mat-icon aria-hidden="true">{{ check.passed ? 'check_circle' : 'cancel' }}</mat-icon>
          <div>
            <div><strong>{{ check.name }}</strong>: {{ check.passed ? 'passed' : 'failed' }}</div>
            <div class="detail">{{ check.detail }}</div>
          </div>
        </li>
      }
    </ul>
  `,
  styles: `
    :host { display: block; }
    .checks { list-style: none; padding: 0; margin: 0; }
    li { display: flex; gap: 8px; padding: 6px 0; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    mat-icon { flex: 0 0 auto; color: var(--mat-sys-primary); }
    li.failed mat-icon { color: var(--mat-sys-error); }
    .detail { font: var(--mat-sys-body-small); overflow-wrap: anywhere; margin: 4px 0; }
  `,
})
export class CheckList {
  readonly checks = input.required<readonly CheckResult[]>();
}
