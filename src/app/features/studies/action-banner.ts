import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * A notice that asks for one action, with the action's button beside the words:
 * `<app-action-banner icon="update" text="…"><button …>Run again</button></app-action-banner>`.
 */
@Component({
  selector: 'app-action-banner',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <div class="banner" role="status">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <span>{{ text() }}</span>
      <span class="action"><ng-content /></span>
    </div>
  `,
  styles: `
    :host { display: block; margin-bottom: 12px; }
    .banner {
      display: flex; align-items: center; gap: 12px; padding: 8px 16px; border-radius: 8px;
      background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container);
    }
    span { flex: 1 1 auto; }
    .action { flex: 0 0 auto; white-space: nowrap; }
  `,
})
export class ActionBanner {
  readonly icon = input.required<string>();
  readonly text = input.required<string>();
}
