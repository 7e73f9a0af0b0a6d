import { ChangeDetectionStrategy, Component, inject, viewChild } from '@angular/core';
import { StudyStore } from '../../study/study-store';
import { SetupForm } from '../setup-form';
import { HoldsSetup } from '../unsaved-setup.guard';

/** The Setup tab of a study page. */
@Component({
  selector: 'app-setup-tab',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SetupForm],
  template: `
    @if (store.study(); as study) {
      <app-setup-form [study]="study" [readonly]="!store.editable()" />
    }
  `,
})
export class SetupTab implements HoldsSetup {
  protected readonly store = inject(StudyStore);
  private readonly form = viewChild(SetupForm);

  hasUnsavedSetup(): boolean {
    return this.form()?.hasUnsavedChanges() ?? false;
  }
}
