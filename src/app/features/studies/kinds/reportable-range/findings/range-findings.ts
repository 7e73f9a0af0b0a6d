import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { reportableRangeMeta } from '@shared/kinds/reportable-range/meta';
import {
  VERDICT_HEADLINES, bestFitSentence, claimText, designRows, fitRows, levelHeadings, levelRows, rangeText, verdictSentence,
} from '@shared/kinds/reportable-range/words';
import type { Analysis, Study } from '@shared/schemas';
import { CAUTION } from '@shared/stats/comparison-types';
import { resolutionRule } from '@shared/types/resolution-words';
import { ErrorBanner } from '../../../../../ui/error-banner';
import { FindingsChart } from '../../../findings/charts/findings-chart';
import { rangeOwn } from '../own-settings';
import { deviationPicture } from './deviation-picture';
import { RangeDeviationTrack } from './deviation-track';
import { rangePlot } from './range-chart';
import { asRange, rangeFormat } from './range-result';

/**
 * The Findings of a reportable-range study, conclusion first: the verdict with the verified range and the claimed
 * interval in words; the results against the levels with the straight line, the best fit and the allowable band; the
 * deviation at each level as a picture against the goal; the level table; the polynomial fits; then the warnings and the
 * design. Every sentence and cell comes from shared/kinds/reportable-range/words.ts (the PDF's and the workbook's too).
 * The decision-support caution stands above every panel on the Findings tab (and on the review page); a caution of the
 * results' own that says more is shown here too.
 */
@Component({
  selector: 'app-range-findings',
  styleUrl: './range-findings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ErrorBanner, FindingsChart, RangeDeviationTrack],
  template: `
    @if (result(); as r) {
      <section class="panel" aria-labelledby="range-heading" data-testid="range-conclusion">
        <h2 id="range-heading">Reportable range</h2>
        <p class="verdict" [class.accepted]="verdict().tone === 'pass'" [class.refused]="verdict().tone === 'fail'" data-testid="range-verdict">
          <mat-icon aria-hidden="true">{{ verdict().icon }}</mat-icon><span>{{ headline() }}</span>
        </p>
        <p data-testid="range-sentence">{{ sentence() }}</p>
        <table class="facts" data-testid="range-facts">
          <tbody>
            <tr><th scope="row">Verified range</th><td>{{ range() }}</td></tr>
            <tr><th scope="row">Claimed measuring interval</th><td>{{ claim() }}</td></tr>
          </tbody>
        </table>
        @if (ownCaution(); as c) {
          <p class="small" data-testid="range-caution">{{ c }}</p>
        }
      </section>

      <section class="panel" aria-labelledby="range-plot-heading" data-testid="range-linearity">
        <h2 id="range-plot-heading">Linearity</h2>
        <app-findings-chart type="scatter" [data]="{ datasets: plot().datasets }" heading="Results against the levels" [caption]="plot().caption"
          [xTitle]="plot().xTitle" [yTitle]="plot().yTitle" [xAxis]="plot().x" [yAxis]="plot().y" [markers]="plot().markers" testId="plot-linearity" />
        <h3>Deviation from the straight line at each level, against the allowable nonlinearity</h3>
        <app-range-deviation-track [picture]="picture()" />
      </section>

      <section class="panel" aria-labelledby="range-levels-heading" data-testid="range-levels">
        <h2 id="range-levels-heading">Levels</h2>
        @if (rule(); as rule) {
          <p class="resolution-rule" data-testid="resolution-rule"><mat-icon aria-hidden="true">straighten</mat-icon><span>{{ rule }}</span></p>
        }
        <div class="table-scroll">
          <table data-testid="level-table" aria-label="Deviation from linearity and recovery at each level">
            <thead>
              <tr>
                <th scope="col">{{ headings().level }}</th>
                <th scope="col" class="num">{{ headings().x }}</th>
                <th scope="col" class="num">{{ headings().n }}</th>
                <th scope="col" class="num">{{ headings().mean }}</th>
                <th scope="col" class="num">{{ headings().sd }}</th>
                <th scope="col" class="num">{{ headings().linear }}</th>
                <th scope="col" class="num">{{ headings().fitted }}</th>
                <th scope="col" class="num">{{ headings().deviation }}</th>
                <th scope="col" class="num">{{ headings().deviationPercent }}</th>
                <th scope="col" class="num">{{ headings().ci }}</th>
                <th scope="col" class="num">{{ headings().goal }}</th>
                @if (recovery()) { <th scope="col" class="num">{{ headings().recovery }}</th> }
                <th scope="col">{{ headings().within }}</th>
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track $index; let i = $index) {
                <tr [attr.data-testid]="'level-row-' + i">
                  <th scope="row">{{ row.level }}</th>
                  <td class="num">{{ row.x }}</td>
                  <td class="num">{{ row.n }}</td>
                  <td class="num">{{ row.mean }}</td>
                  <td class="num">{{ row.sd }}</td>
                  <td class="num">{{ row.linear }}</td>
                  <td class="num">{{ row.fitted }}</td>
                  <td class="num">{{ row.deviation }}</td>
                  <td class="num">{{ row.deviationPercent }}</td>
                  <td class="num">{{ row.ci }}</td>
                  <td class="num">{{ row.goal }}</td>
                  @if (recovery()) { <td class="num">{{ row.recovery }}</td> }
                  <td class="judgement" [class.accepted]="r.levels[i].within" [class.refused]="!r.levels[i].within">{{ row.within }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      </section>

      <section class="panel" aria-labelledby="range-fits-heading" data-testid="range-fits">
        <h2 id="range-fits-heading">Polynomial fits</h2>
        <p class="small" data-testid="best-fit">{{ bestFit() }}</p>
        <div class="table-scroll">
          <table data-testid="fit-table" aria-label="Least-squares polynomials of degree 1 to 3">
            <thead>
              <tr>
                <th scope="col" class="num">Degree</th>
                <th scope="col">Coefficients, y = b0 + b1·x + …</th>
                <th scope="col">Their standard errors</th>
                <th scope="col" class="num">p of the top coefficient</th>
                <th scope="col" class="num">{{ syxHeading() }}</th>
                <th scope="col">Judgement</th>
              </tr>
            </thead>
            <tbody>
              @for (fit of fits(); track fit.degree) {
                <tr [attr.data-testid]="'fit-' + fit.degree" [class.best]="fit.degree === bestDegree()">
                  <td class="num">{{ fit.degree }}</td>
                  <td class="coefficients">{{ fit.coefficients }}</td>
                  <td class="coefficients">{{ fit.se }}</td>
                  <td class="num">{{ fit.p }}</td>
                  <td class="num">{{ fit.syx }}</td>
                  <td>
                    @if (fit.degree === bestDegree()) { <mat-icon class="inline" aria-hidden="true">star</mat-icon> }
                    {{ fit.judgement }}
                  </td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      </section>

      <section class="panel" aria-labelledby="range-design-heading" data-testid="range-design">
        <h2 id="range-design-heading">Warnings and design</h2>
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
      </section>
    } @else {
      <app-error-banner message="These results are not those of a reportable-range study; Parallax cannot show them here." />
    }
  `,
})
export class RangeFindings {
  readonly study = input.required<Study>();
  readonly analysis = input.required<Analysis>();
  /** The results as the Findings tab hands them over; without them, the analysis's own. */
  readonly results = input<unknown>(undefined);

  /** The results, with the source of the goal from the study where the served results do not carry it. */
  protected readonly result = computed(() => {
    const r = asRange(this.results() ?? this.analysis().results);
    if (!r || r.goal?.source !== undefined) return r;
    return { ...r, goal: { ...r.goal, source: rangeOwn(this.study().settings).nonlinearitySource } };
  });
  private readonly format = computed(() => rangeFormat(this.study()));
  protected readonly verdict = computed(() => reportableRangeMeta.verdicts.find((v) => v.key === this.result()!.verdict) ?? reportableRangeMeta.verdicts[2]);
  protected readonly headline = computed(() => VERDICT_HEADLINES[this.result()!.verdict]);
  protected readonly sentence = computed(() => verdictSentence(this.result()!, this.format()));
  protected readonly range = computed(() => rangeText(this.result()!, this.format()));
  protected readonly claim = computed(() => claimText(this.result()!.claimed, this.format()));
  protected readonly bestFit = computed(() => bestFitSentence(this.result()!));
  /** The best degree as the fits table writes a degree ("3"). */
  protected readonly bestDegree = computed(() => String(this.result()!.bestDegree));
  protected readonly plot = computed(() => rangePlot(this.result()!, this.format()));
  protected readonly picture = computed(() => deviationPicture(this.result()!, this.format()));
  protected readonly headings = computed(() => levelHeadings(this.result()!, this.format()));
  protected readonly rows = computed(() => levelRows(this.result()!, this.format()));
  /** Recovery needs assigned values: on the fraction basis the column would be empty, so it is left out. */
  protected readonly recovery = computed(() => this.result()!.basis !== 'fraction');
  protected readonly fits = computed(() => fitRows(this.result()!, this.format()));
  protected readonly syxHeading = computed(() => (this.format().unit ? `Sy.x (${this.format().unit})` : 'Sy.x'));
  protected readonly design = computed(() => designRows(this.result()!, this.format()));
  protected readonly rule = computed(() => resolutionRule(this.result()!.resolution, this.format().unit));
  /** The results' caution where it says more than the one the Findings tab shows above every panel. */
  protected readonly ownCaution = computed(() => {
    const c = this.result()?.caution?.trim();
    return c && c !== CAUTION ? c : null;
  });
}
