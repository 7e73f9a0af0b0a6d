import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { STUDY_KIND_LABELS, type StudyKind } from '@shared/schemas';

/** "Start study": one click when one kind of study fits, a choice of kinds when several do. */
@Component({
  selector: 'app-start-study-button',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    @if (kinds().length === 1) {
      <button mat-stroked-button type="button" [disabled]="disabled()" (click)="chosen.emit(kinds()[0])" [attr.data-testid]="testId()"
        [attr.title]="'Start a draft ' + label(kinds()[0]) + ' study'">
        <mat-icon>play_arrow</mat-icon> Start study
      </button>
    } @else {
      <button mat-stroked-button type="button" [disabled]="disabled() || kinds().length === 0" [matMenuTriggerFor]="menu" [attr.data-testid]="testId()">
        <mat-icon>play_arrow</mat-icon> Start study <mat-icon iconPositionEnd>arrow_drop_down</mat-icon>
      </button>
      <mat-menu #menu="matMenu" xPosition="before">
        <p class="menu-title" mat-menu-item disabled>Which kind of study?</p>
        @for (k of kinds(); track k) {
          <button mat-menu-item type="button" (click)="chosen.emit(k)" [attr.data-testid]="testId() + '-kind-' + k">{{ label(k) }}</button>
        }
      </mat-menu>
    }
  `,
  styles: `.menu-title { font: var(--mat-sys-label-medium); }`,
})
export class StartStudyButton {
  readonly kinds = input.required<readonly StudyKind[]>();
  readonly testId = input('start-study');
  readonly disabled = input(false);
  readonly chosen = output<StudyKind>();
  protected readonly label = (kind: StudyKind): string => STUDY_KIND_LABELS[kind] ?? kind;
}
