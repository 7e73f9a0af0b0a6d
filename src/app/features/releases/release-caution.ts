import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RELEASE_CAUTION } from '../../../../shared/schemas';

/** The caution every release page carries: releasing a method is the director's judgement under local rules. It prints too. */
@Component({
  selector: 'app-release-caution',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `<p class="caution" data-testid="release-caution"><mat-icon aria-hidden="true">info</mat-icon><span>{{ text() || fallback }}</span></p>`,
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
export class ReleaseCaution {
  /** The server's words (a release answer's `caution`); the shared text until it arrives. */
  readonly text = input<string | null | undefined>(null);
  protected readonly fallback = RELEASE_CAUTION;
}
