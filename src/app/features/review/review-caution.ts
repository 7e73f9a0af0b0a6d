import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION } from '@shared/text/caution';

/** The caution the review page always carries, in full (shared/text/caution.ts): findings support the director's decision, they do not make it. */

@Component({
  selector: 'app-review-caution',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <aside class="caution" aria-label="Caution" data-testid="review-caution">
      <mat-icon aria-hidden="true">gavel</mat-icon>
      <p><strong>Caution.</strong> {{ text }}</p>
    </aside>
  `,
  styles: `
    .caution {
      display: flex; gap: 12px; align-items: flex-start; margin: 16px 0; padding: 12px 16px;
      border: 2px solid var(--mat-sys-tertiary); border-radius: 8px;
      background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container);
      font: var(--mat-sys-body-large); break-inside: avoid;
    }
    p { margin: 0; }
  `,
})
export class ReviewCaution {
  protected readonly text = CAUTION;
}
