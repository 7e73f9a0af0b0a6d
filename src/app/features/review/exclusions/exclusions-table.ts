import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { ExclusionRow } from './exclusion-rows';

/** The excluded specimens with their reasons, as a table; a sentence when none is excluded. */
@Component({
  selector: 'app-exclusions-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styleUrl: './exclusions-table.scss',
  template: `
    <section aria-labelledby="exclusions-title" data-testid="exclusions">
      <h2 id="exclusions-title">Excluded specimens ({{ rows().length }})</h2>
      @if (rows().length === 0) {
        <p class="muted" data-testid="no-exclusions">No specimen is excluded: the findings use every row.</p>
      } @else {
        <p class="muted">Excluded rows stay in the record; the findings leave them out and show the main estimates both ways.</p>
        <div class="table-scroll">
          <table>
            <thead>
              <tr><th scope="col" class="num">Row</th><th scope="col">Specimen</th><th scope="col">Results</th><th scope="col">Reason for the exclusion</th></tr>
            </thead>
            <tbody>
              @for (r of rows(); track r.position) {
                <tr [attr.data-testid]="'excluded-' + r.position">
                  <td class="num">{{ r.position }}</td><td>{{ r.label }}</td><td>{{ r.results }}</td><td>{{ r.reason }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
    </section>
  `,
})
export class ExclusionsTable {
  readonly rows = input.required<readonly ExclusionRow[]>();
}
