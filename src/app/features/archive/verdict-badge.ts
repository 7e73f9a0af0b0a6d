import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { OverallVerdict } from '@shared/schemas';
import { verdictView } from './verdict-view';

/** A verdict as an icon and a word (the sentence on hover and for screen readers); the tint only repeats it. */
@Component({
  selector: 'app-verdict-badge',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <span class="verdict" [attr.data-verdict]="view().key" [attr.data-tone]="view().tone" [attr.title]="view().sentence" data-testid="verdict">
      <mat-icon aria-hidden="true">{{ view().icon }}</mat-icon>
      <span>{{ view().word }}</span>
      <span class="sr-only">: {{ view().sentence }}</span>
    </span>
  `,
  styles: `
    .verdict {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      white-space: nowrap;
    }
    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
    [data-tone='pass'] mat-icon, [data-tone='record'] mat-icon {
      color: var(--mat-sys-primary);
    }
    [data-tone='fail'] mat-icon {
      color: var(--mat-sys-error);
    }
    [data-tone='open'] mat-icon {
      color: var(--mat-sys-tertiary);
    }
    [data-tone='none'] {
      color: var(--mat-sys-on-surface-variant);
    }
    .sr-only {
      position: absolute;
      width: 1px;
      height: 1px;
      overflow: hidden;
      clip: rect(0 0 0 0);
      white-space: nowrap;
    }
  `,
})
export class VerdictBadge {
  readonly verdict = input<OverallVerdict | null>(null);
  protected readonly view = computed(() => verdictView(this.verdict()));
}
