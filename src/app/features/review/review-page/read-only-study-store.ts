import { Injectable, computed } from '@angular/core';
import { StudyStore } from '../../studies/study/study-store';

/**
 * The study as the review page holds it: read, never edited. The findings panels of the studies feature
 * offer to exclude rows when the study is editable; on the review nothing changes the record.
 */
@Injectable()
export class ReadOnlyStudyStore extends StudyStore {
  override readonly editable = computed(() => false);
}
