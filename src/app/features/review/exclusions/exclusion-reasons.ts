import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { ExclusionRow } from './exclusion-rows';

/**
 * The excluded rows' reasons, short, where a panel of the review mentions the exclusions: the review has
 * no Specimens tab to send the reader to.
 */
@Component({
  selector: 'app-exclusion-reasons',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    :host { display: block; }
    ul { margin: 4px 0 12px; padding-left: 20px; }
    li { margin: 2px 0; }
    .row { font-weight: 500; }
  `,
  template: `
    <ul data-testid="exclusion-reasons">
      @for (r of rows(); track r.position) {
        <li [attr.data-testid]="'exclusion-reason-' + r.position"><span class="row">Row {{ r.position }}@if (r.label !== '—') { ({{ r.label }})}</span>: {{ r.reason }}</li>
      }
    </ul>
  `,
})
export class ExclusionReasons {
  readonly rows = input.required<readonly ExclusionRow[]>();
}
