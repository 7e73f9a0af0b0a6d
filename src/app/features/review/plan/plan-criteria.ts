import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { HistoryEvent, Signature, Study } from '@shared/schemas';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { planRows } from '../../studies/kinds/plan-rows';

/**
 * The plan and acceptance criteria as they stand, the director's plan approval if any, and — standing
 * out — every criterion that moved after that approval, with who, when, from what to what and why.
 */
@Component({
  selector: 'app-plan-criteria',
  templateUrl: './plan-criteria.html',
  styleUrl: './plan-criteria.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ZonedPipe],
})
export class PlanCriteria {
  readonly study = input.required<Study>();
  readonly approval = input<Signature | null>(null);
  /** The history's 'study.plan-amended' events, oldest first. */
  readonly moved = input<readonly HistoryEvent[]>([]);

  protected readonly zone = labZone();
  protected readonly rows = computed(() => planRows(this.study()));
}
