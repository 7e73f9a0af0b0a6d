import { ChangeDetectionStrategy, Component, inject, viewChild } from '@angular/core';
import { Router } from '@angular/router';
import type { Study } from '@shared/schemas';
import { Notices } from '../../../../core/notify/notices';
import { SetupForm } from '../setup-form';
import { HoldsSetup } from '../unsaved-setup.guard';

/** Studies › New study: the Setup form of a study not yet created; once created, on to its specimens. */
@Component({
  selector: 'app-new-study-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SetupForm],
  template: `
    <section class="page">
      <h1>New study</h1>
      <p class="muted">Plan the study before collecting results: the methods, the goals with their source, and the rules you will judge by.</p>
      <app-setup-form (created)="open($event)" />
    </section>
  `,
})
export class NewStudyPage implements HoldsSetup {
  private readonly router = inject(Router);
  private readonly form = viewChild(SetupForm);

  hasUnsavedSetup(): boolean {
    return this.form()?.hasUnsavedChanges() ?? false;
  }

  private readonly notices = inject(Notices);

  protected open(study: Study): void {
    this.notices.post(`${study.title} is created. Enter or paste its specimen results.`);
    void this.router.navigate(['/studies', study.id, 'specimens']);
  }
}
