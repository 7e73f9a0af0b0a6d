import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS, type Study } from '@shared/schemas';
import { ZonedPipe, labZone } from '../../../ui/lab-time';

/** What a study is, read-only: kind, analyte, instruments, state, and the amendments it belongs to. */
@Component({
  selector: 'app-study-overview',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, RouterLink, ZonedPipe],
  templateUrl: './study-overview.html',
  styleUrl: './study-overview.scss',
})
export class StudyOverview {
  readonly study = input.required<Study>();
  protected readonly zone = labZone();
  protected readonly kinds = STUDY_KIND_LABELS;
  protected readonly states = STUDY_STATE_LABELS;
}
