import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { CHANGE_TYPE_LABELS, type ChangeType, type ReleaseTemplate } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { showApiError } from '../../../core/http/form-errors';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { ReleaseApi } from '../../releases/release-api';
import { kindsWords } from '../../releases/release-words';
import { dueRuleArray, dueRulesOf, requirementArray, requirementsOf } from '../../releases/requirement-rows/requirement-form';
import { RequirementRows } from '../../releases/requirement-rows/requirement-rows';
import { DueRuleRows } from './due-rule-rows';

interface Editing {
  changeType: ChangeType;
  version: number;
  form: FormGroup<{ requirements: ReturnType<typeof requirementArray>; dueRules: ReturnType<typeof dueRuleArray> }>;
}

const editorFor = (t: ReleaseTemplate): Editing => ({
  changeType: t.changeType,
  version: t.version,
  form: new FormGroup({ requirements: requirementArray(t.requirements), dueRules: dueRuleArray(t.dueRules) }),
});

/**
 * Admin › Release templates: for each change type, the studies a release needs (each met by a signed study of the kinds
 * named) and the re-verifications a release sets due, months after its go-live date. Saved with the version read, so
 * two administrators never overwrite each other unknowingly.
 */
@Component({
  selector: 'app-release-templates-page',
  templateUrl: './release-templates-page.html',
  styleUrl: './release-templates-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, ZonedPipe, RequirementRows, DueRuleRows],
})
export class ReleaseTemplatesPage {
  private readonly api = inject(ReleaseApi);
  private readonly notices = inject(Notices);
  protected readonly zone = labZone();
  protected readonly templates = signal<ReleaseTemplate[]>([]);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  protected readonly editing = signal<Editing | null>(null);
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly kindsWords = kindsWords;
  protected readonly label = (type: ChangeType): string => CHANGE_TYPE_LABELS[type] ?? type;
  protected readonly editingLabel = computed(() => (this.editing() ? this.label(this.editing()!.changeType) : ''));

  constructor() {
    this.api.templates().subscribe({
      next: (list) => {
        this.templates.set(list);
        this.loading.set(false);
      },
      error: (err: ApiError) => {
        this.loading.set(false);
        this.loadError.set(`The templates could not be read: ${err.message}`);
      },
    });
  }

  protected edit(template: ReleaseTemplate): void {
    this.problem.set(null);
    this.editing.set(editorFor(template));
  }

  protected cancel(): void {
    this.problem.set(null);
    this.editing.set(null);
  }

  protected save(): void {
    const editing = this.editing();
    if (!editing || this.saving()) return;
    this.problem.set(null);
    const { form } = editing;
    form.markAllAsTouched();
    if (form.invalid) {
      this.problem.set('Some fields need a look before the template can be saved.');
      return;
    }
    this.saving.set(true);
    const body = { version: editing.version, requirements: requirementsOf(form.controls.requirements), dueRules: dueRulesOf(form.controls.dueRules) };
    this.api.saveTemplate(editing.changeType, body).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.templates.update((list) => list.map((t) => (t.changeType === saved.changeType ? saved : t)));
        this.editing.set(null);
        this.notices.post(`The template for “${this.label(saved.changeType)}” is saved; new releases of that change follow it.`);
      },
      error: (err: ApiError) => {
        this.saving.set(false);
        this.problem.set(showApiError(form, err));
      },
    });
  }
}
