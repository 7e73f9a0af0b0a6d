import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { ReleaseState } from '@shared/schemas';
import { releaseStateBadge } from './release-words';

/** A release's state as a chip: an icon and the words; the tint only repeats them. */
@Component({
  selector: 'app-release-state-chip',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <span class="chip" [attr.data-state]="state()" data-testid="release-state-chip">
      <mat-icon aria-hidden="true">{{ badge().icon }}</mat-icon>{{ badge().word }}
    </span>
  `,
  styles: `
    .chip {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 12px;
      font: var(--mat-sys-label-medium);
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
      white-space: nowrap;
    }
    mat-icon { font-size: 18px; width: 18px; height: 18px; }
    [data-state='released'] { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    [data-state='not-released'], [data-state='needs-review'] { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); }
  `,
})
export class ReleaseStateChip {
  readonly state = input.required<ReleaseState>();
  protected readonly badge = computed(() => releaseStateBadge(this.state()));
}
