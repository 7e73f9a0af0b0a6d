import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { startWith } from 'rxjs';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { showApiError } from '../../../core/http/form-errors';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { laboratoryTime } from '@shared/types/lab-time';
import { LaboratoryApi, type Laboratory } from './laboratory-api';
import { isTimeZone, knownTimeZones, matchingZones, timeZoneRule } from './time-zones';

/** Laboratory: the administrator sets the time zone every page shows and the two rules of sign-off. */
@Component({
  selector: 'app-laboratory-settings-page',
  templateUrl: './laboratory-settings-page.html',
  styleUrl: './laboratory-settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatAutocompleteModule, MatCheckboxModule, MatButtonModule, MatIconModule,
    MatProgressBarModule, ErrorBanner, FieldErrorPipe,
  ],
})
export class LaboratorySettingsPage {
  private readonly api = inject(LaboratoryApi);
  private readonly auth = inject(AuthStore);
  private readonly notices = inject(Notices);
  private readonly zones = knownTimeZones();
  protected readonly form = inject(FormBuilder).nonNullable.group({
    timeZone: ['', [Validators.required, timeZoneRule]],
    planApprovalRequired: false,
    allowSelfSign: false,
  });
  private readonly typedZone = toSignal(this.form.controls.timeZone.valueChanges.pipe(startWith('')), { initialValue: '' });
  protected readonly zoneOptions = computed(() => matchingZones(this.zones, this.typedZone()));
  /** The time now in the zone typed, once it is a zone (read from the signal, not the form's status, so it follows every change). */
  protected readonly preview = computed(() => {
    const zone = this.typedZone();
    return isTimeZone(zone) ? `Now there: ${laboratoryTime(new Date(), zone)}` : '';
  });
  protected readonly laboratory = signal<Laboratory | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.api.get().subscribe({
      next: (lab) => this.show(lab),
      error: (err: ApiError) => {
        this.loading.set(false);
        this.error.set(err.message);
      },
    });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.saving()) return;
    this.saving.set(true);
    this.error.set(null);
    this.api.save(this.form.getRawValue()).subscribe({
      next: (lab) => {
        this.saving.set(false);
        this.show(lab);
        this.notices.post('Laboratory settings saved.');
        void this.auth.restore();
      },
      error: (err: ApiError) => {
        this.saving.set(false);
        this.error.set(showApiError(this.form, err));
      },
    });
  }

  private show(lab: Laboratory): void {
    this.laboratory.set(lab);
    this.loading.set(false);
    this.form.reset({ timeZone: lab.timeZone, planApprovalRequired: lab.planApprovalRequired, allowSelfSign: lab.allowSelfSign });
  }
}
