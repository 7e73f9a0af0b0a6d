import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Analysis, Study } from '@shared/schemas';
import { CAUTION } from '@shared/stats/comparison-types';
import {
  anyNotVerified, componentHeadings, componentRows, designRows, flaggedRows, materialSummary, overallSentence, resultHeading, termsNote,
  truenessRows, verdictLines, type VerdictLine,
} from '@shared/kinds/precision/words';
import type { PrecisionVerdict } from '@shared/stats/precision-types';
import { ErrorBanner } from '../../../../../ui/error-banner';
import { dayPlot } from './precision-chart';
import { PrecisionDayPlot } from './precision-day-plot';
import { asPrecision, precisionFormat } from './precision-result';

/** One verdict of a material in words (shared/kinds/precision/words.ts), with its icon (the words say it; the icon and the ink repeat it). */
interface IconLine extends VerdictLine {
  icon: string;
}

const ICONS: Record<PrecisionVerdict, string> = { verified: 'check_circle', consistent: 'task_alt', 'not-verified': 'cancel' };

/**
 * The Findings of a precision verification, conclusion first: the verdict over every material, then per
 * material its verdicts in words (repeatability, within-laboratory precision, trueness where an assigned value
 * is given), the table of the three components against the claims, its notes and flagged replicates, and the
 * plot of its days; then the warnings and the design. The decision-support caution stands above every panel
 * on the Findings tab; a caution of the results' own that says more is shown here too.
 */
@Component({
  selector: 'app-precision-findings',
  styleUrl: './precision-findings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ErrorBanner, PrecisionDayPlot],
  template: `
    @if (result(); as r) {
      <section class="panel" aria-labelledby="precision-heading" data-testid="precision-conclusion">
        <h2 id="precision-heading">Precision against the manufacturer's claims</h2>
        <p class="verdict" [class.accepted]="!notVerified()" [class.refused]="notVerified()" data-testid="precision-overall">{{ overall() }}</p>
      </section>
      @for (m of materials(); track m.key; let i = $index) {
        <section class="panel" [attr.aria-labelledby]="'material-heading-' + i" [attr.data-testid]="'material-' + i">
          <h2 [id]="'material-heading-' + i">{{ m.name }}</h2>
          <p class="muted" [attr.data-testid]="'material-summary-' + i">{{ m.summary }}</p>
          <ul class="verdicts">
            @for (v of m.verdicts; track v.key) {
              <li class="verdict" [class.accepted]="v.verdict !== null && v.verdict !== 'not-verified'" [class.refused]="v.verdict === 'not-verified'" [attr.data-testid]="'verdict-' + v.key + '-' + i">
                <mat-icon aria-hidden="true">{{ v.icon }}</mat-icon><span>{{ v.text }}</span>
              </li>
            }
          </ul>
          <div class="table-scroll">
            <table [attr.data-testid]="'components-' + i" [attr.aria-label]="'Precision components of ' + m.name">
              <thead>
                <tr>
                  <th scope="col">Component</th>
                  <th scope="col" class="num">{{ m.headings.sd }}</th>
                  <th scope="col" class="num">{{ m.headings.cv }}</th>
                  <th scope="col" class="num">df</th>
                  <th scope="col" class="num">{{ m.headings.ci }}</th>
                  <th scope="col" class="num">{{ m.headings.claim }}</th>
                  <th scope="col" class="num">{{ m.headings.uvl }}</th>
                  <th scope="col">Verdict</th>
                </tr>
              </thead>
              <tbody>
                @for (row of m.rows; track row.key) {
                  <tr [attr.data-testid]="'row-' + row.key">
                    <th scope="row">{{ row.name }}</th>
                    <td class="num">{{ row.sd }}</td>
                    <td class="num">{{ row.cv }}</td>
                    <td class="num">{{ row.df }}</td>
                    <td class="num">{{ row.ci }}</td>
                    <td class="num">{{ row.claim }}</td>
                    <td class="num">{{ row.uvl }}</td>
                    <td [class.accepted]="row.verdictKey !== null && row.verdictKey !== 'not-verified'" [class.refused]="row.verdictKey === 'not-verified'">{{ row.verdict }}</td>
                  </tr>
                }
              </tbody>
            </table>
          </div>
          <p class="small" [attr.data-testid]="'terms-' + i">{{ m.termsNote }}</p>
          @if (m.trueness.length > 0) {
            <h3>Trueness against the assigned value</h3>
            <table [attr.data-testid]="'trueness-' + i" [attr.aria-label]="'Trueness of ' + m.name">
              <tbody>
                @for (t of m.trueness; track t[0]) {
                  <tr><th scope="row">{{ t[0] }}</th><td class="num">{{ t[1] }}</td></tr>
                }
              </tbody>
            </table>
          }
          @if (m.notes.length > 0) {
            <h3>Notes</h3>
            <ul [attr.data-testid]="'notes-' + i">
              @for (n of m.notes; track $index) { <li>{{ n }}</li> }
            </ul>
          }
          @if (m.flagged.length > 0) {
            <h3>Flagged replicates</h3>
            <p class="small">Flagged for a look, not removed: they are part of the findings above until excluded with a reason on the Specimens tab.</p>
            <div class="table-scroll">
              <table [attr.data-testid]="'flagged-' + i">
                <thead>
                  <tr><th scope="col">Day</th><th scope="col" class="num">Replicate</th><th scope="col" class="num">{{ resultHeading() }}</th><th scope="col" class="num">Row</th><th scope="col">Why</th></tr>
                </thead>
                <tbody>
                  @for (o of m.flagged; track $index) {
                    <tr><td>{{ o.day }}</td><td class="num">{{ o.replicate }}</td><td class="num">{{ o.value }}</td><td class="num">{{ o.row }}</td><td class="why">{{ o.why }}</td></tr>
                  }
                </tbody>
              </table>
            </div>
          }
          <app-precision-day-plot [plot]="m.plot" [heading]="'Results by day: ' + m.name" [yTitle]="yTitle()" [testId]="'plot-days-' + i" />
        </section>
      }
      <section class="panel" aria-labelledby="precision-design-heading" data-testid="precision-design">
        <h2 id="precision-design-heading">Warnings and design</h2>
        @if (r.warnings.length > 0) {
          <h3>Warnings</h3>
          <ul class="warnings" data-testid="warnings">
            @for (w of r.warnings; track $index) { <li>{{ w }}</li> }
          </ul>
        } @else {
          <p class="muted" data-testid="no-warnings">No warnings.</p>
        }
        <h3>Design</h3>
        <table data-testid="design">
          <tbody>
            @for (d of design(); track d[0]) {
              <tr><th scope="row">{{ d[0] }}</th><td>{{ d[1] }}</td></tr>
            }
          </tbody>
        </table>
        @if (ownCaution(); as c) {
          <p class="small" data-testid="precision-caution">{{ c }}</p>
        }
      </section>
    } @else {
      <app-error-banner message="These results are not those of a precision verification; Parallax cannot show them here." />
    }
  `,
})
export class PrecisionFindings {
  readonly study = input.required<Study>();
  readonly analysis = input.required<Analysis>();
  /** The results as the Findings tab hands them over; without them, the analysis's own. */
  readonly results = input<unknown>(undefined);

  protected readonly result = computed(() => asPrecision(this.results() ?? this.analysis().results));
  private readonly format = computed(() => precisionFormat(this.study()));
  protected readonly resultHeading = computed(() => resultHeading(this.format()));
  protected readonly yTitle = computed(() => (this.format().unit ? `Result (${this.format().unit})` : 'Result'));
  protected readonly overall = computed(() => overallSentence(this.result()!));
  protected readonly notVerified = computed(() => anyNotVerified(this.result()!));
  protected readonly design = computed(() => designRows(this.result()!));
  /** The results' caution where it says more than the one the Findings tab shows above every panel. */
  protected readonly ownCaution = computed(() => {
    const c = this.result()?.caution?.trim();
    return c && c !== CAUTION ? c : null;
  });
  protected readonly materials = computed(() => {
    const r = this.result()!;
    const f = this.format();
    return r.materials.map((m, i) => {
      const verdicts: IconLine[] = verdictLines(m, r, f).map((v) => ({ ...v, icon: v.verdict ? ICONS[v.verdict] : 'help' }));
      return {
        key: `${i}:${m.name}`, name: m.name, summary: materialSummary(m, f), verdicts,
        headings: componentHeadings(m, f, r.alpha), rows: componentRows(m, f), termsNote: termsNote(m, f),
        trueness: truenessRows(m, f, r), notes: m.notes, flagged: flaggedRows(m, f), plot: dayPlot(m, f),
      };
    });
  });
}
