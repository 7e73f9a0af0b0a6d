import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { STUDY_KIND_LABELS, type BoardRequirement, type ComponentStudy, type StudyKind } from '@shared/schemas';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { meaningWords } from '../../archive/verdict-view';
import { kindsWords, requirementBadge, studyLink, studyStateWord } from '../release-words';
import { StartStudyButton } from '../start-study-button';

/**
 * One requirement on a release's board: what it needs, where it stands (icon and word), the study that meets it or
 * "missing", a waiver with its reason, and the actions the signed-in person may take on it.
 */
@Component({
  selector: 'app-requirement-card',
  templateUrl: './requirement-card.html',
  styleUrl: './requirement-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, RouterLink, ZonedPipe, StartStudyButton],
})
export class RequirementCard {
  readonly requirement = input.required<BoardRequirement>();
  /** Start and link studies (a technologist or director, on an open release or one waiting for review). */
  readonly canLink = input(false);
  /** Unlink studies (a technologist or director, on an open release). */
  readonly canUnlink = input(false);
  /** Waive it (a director, on an open release or one waiting for review). */
  readonly canWaive = input(false);
  readonly busy = input(false);

  readonly start = output<StudyKind>();
  readonly link = output<void>();
  readonly unlink = output<ComponentStudy>();
  readonly waive = output<void>();

  protected readonly zone = labZone();
  protected readonly badge = computed(() => requirementBadge(this.requirement().status));
  /** Every other study linked to it (an amended one, an earlier attempt), newest first. */
  protected readonly others = computed(() => {
    const r = this.requirement();
    return r.linked.filter((s) => s.id !== r.study?.id);
  });
  /** A study may be started or linked while nothing meets it. */
  protected readonly open = computed(() => ['missing', 'not-met'].includes(this.requirement().status));
  protected readonly waivable = computed(() => !['met', 'waived'].includes(this.requirement().status));
  protected readonly kindsWords = kindsWords;
  protected readonly studyLink = studyLink;
  protected readonly stateWord = studyStateWord;
  protected readonly meaning = meaningWords;
  protected readonly kindLabel = (s: ComponentStudy): string => STUDY_KIND_LABELS[s.kind] ?? s.kind;
}
