import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { StudyHistory } from '../../archive/study-history';
import { StudyStore } from './study-store';

/** The study page's History tab: the study's history in words (a child route of the study page, sharing its StudyStore). */
@Component({
  selector: 'app-history-tab',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [StudyHistory],
  template: `
    @if (store.study(); as s) {
      <app-study-history [studyId]="s.id" />
    }
  `,
})
export class HistoryTab {
  protected readonly store = inject(StudyStore);
}
