import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION } from '../../../../shared/stats/comparison-types';

/** The caution every page that shows findings carries; it prints too. */
@Component({
  selector: 'app-decision-caution',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `<p class="caution" data-testid="caution"><mat-icon aria-hidden="true">info</mat-icon><span>{{ text }}</span></p>`,
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
  protected readonly text = CAUTION;
}
