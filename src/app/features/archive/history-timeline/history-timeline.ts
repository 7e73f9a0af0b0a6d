import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { HistoryEvent } from '@shared/schemas';
import { actionIcon } from '../history-actions';
import { ZonedPipe, labZone } from '../../../ui/lab-time';

/** History events as a timeline in words: when (laboratory zone, with seconds), who, what, and the detail lines. */
@Component({
  selector: 'app-history-timeline',
  templateUrl: './history-timeline.html',
  styleUrl: './history-timeline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, RouterLink, ZonedPipe],
})
export class HistoryTimeline {
  readonly events = input.required<readonly HistoryEvent[]>();
  /** Link each event to the audit record of its study (the laboratory-wide history does). */
  readonly linkStudies = input(false);
  protected readonly zone = labZone();
  protected readonly icon = actionIcon;
  /** An event with more detail lines than this shows the first few until opened (print shows them all). */
  protected readonly foldAt = 6;
  protected readonly opened = signal<ReadonlySet<number>>(new Set());

  protected toggle(id: number): void {
    this.opened.update((ids) => {
      const next = new Set(ids);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  }
}
