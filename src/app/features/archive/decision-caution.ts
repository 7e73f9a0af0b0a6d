import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION } from '@shared/text/caution';

/**
 * The caution every page that shows findings carries (the findings' words unless a page gives its own, as a
 * release's page gives the release's); it prints too.
 */
@Component({
  selector: 'app-decision-caution',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `<p class="caution" [attr.data-testid]="testId()"><mat-icon aria-hidden="true">info</mat-icon><span>{{ text() || fallback }}</span></p>`,
  styles: `
    .caution {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin: 0 0 16px;
      padding: 8px 12px;
      border-left: 4px solid var(--mat-sys-tertiary);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      font: var(--mat-sys-body-medium);
    }
    mat-icon {
      flex: 0 0 auto;
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
})
export class DecisionCaution {
  /** The page's own words (a release answer's `caution`); the findings' caution when not given. */
  readonly text = input<string | null | undefined>(null);
  readonly testId = input('caution');
  protected readonly fallback = CAUTION;
}
