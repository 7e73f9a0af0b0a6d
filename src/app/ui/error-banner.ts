import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** An inline message above a form or list; says nothing when there is nothing to say. */
@Component({
  selector: 'app-error-banner',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    @if (message()) {
      <div class="banner" [class.info]="kind() === 'info'" role="alert" data-testid="banner">
        <mat-icon aria-hidden="true">{{ kind() === 'info' ? 'info' : 'error' }}</mat-icon>
        <span>{{ message() }}</span>
      </div>
    }
  `,
  styles: `
    .banner {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 12px 16px;
      margin: 0 0 16px;
      border-radius: 8px;
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
      font: var(--mat-sys-body-medium);
    }
    .banner mat-icon {
      flex: none;
    }
    .banner.info {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
  `,
})
export class ErrorBanner {
  readonly message = input<string | null>(null);
  readonly kind = input<'error' | 'info'>('error');
}
