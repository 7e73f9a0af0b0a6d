import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { startWith } from 'rxjs';
import { RELEASE_MEANING_WORDS, type Release, type ReleaseMeaning } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { showApiError } from '../../../core/http/form-errors';
import { DayDates } from '../../../ui/day-dates';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { ReleaseApi } from '../release-api';

const MEANING_ICONS: Record<ReleaseMeaning, string> = { released: 'verified', 'not-released': 'block' };

/**
 * The director's release signature: released for patient testing (with a go-live date) or not released, a comment
 * and the password again. Closed, with what still blocks it listed, until every requirement is met or waived; who may
 * sign and why is the server's answer (mayISign), shown as it comes.
 */
@Component({
  selector: 'app-sign-panel',
  templateUrl: './sign-panel.html',
  styleUrl: './sign-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, DayDates, ErrorBanner, FieldErrorPipe],
})
export class SignPanel {
  readonly release = input.required<Release>();
  /** The signed release, as the server answered. */
  readonly signed = output<Release>();

  private readonly api = inject(ReleaseApi);
  private readonly auth = inject(AuthStore);
  protected readonly signer = computed(() => this.auth.user()?.name ?? 'you');
  protected readonly choices = (Object.keys(RELEASE_MEANING_WORDS) as ReleaseMeaning[]).map((value) => ({
    value, label: RELEASE_MEANING_WORDS[value], icon: MEANING_ICONS[value],
  }));
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** Signing waits for every requirement (the blockers) and for the server's yes to this director. */
  protected readonly blocked = computed(() => !this.release().ready || !this.release().mayISign.allowed);

  protected readonly form = new FormGroup({
    meaning: new FormControl<ReleaseMeaning | null>(null, [Validators.required]),
    goLiveDate: new FormControl<string | null>(null, [Validators.required]),
    comment: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    password: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  });
  protected readonly meaning = toSignal(this.form.controls.meaning.valueChanges.pipe(startWith(this.form.controls.meaning.value)), { initialValue: null });

  constructor() {
    // The go-live date is asked (and required) only of a release for patient testing; a blocked panel takes no input.
    effect(() => {
      const blocked = this.blocked();
      const meaning = this.meaning();
      untracked(() => {
        if (blocked) this.form.disable({ emitEvent: false });
        else {
          this.form.enable({ emitEvent: false });
          if (meaning !== 'released') this.form.controls.goLiveDate.disable({ emitEvent: false });
        }
      });
    });
  }

  protected sign(): void {
    this.problem.set(null);
    this.form.markAllAsTouched();
    if (this.blocked() || this.form.invalid || this.busy()) return;
    const v = this.form.getRawValue();
    const meaning = v.meaning!;
    this.busy.set(true);
    this.api
      .sign(this.release().id, {
        meaning,
        goLiveDate: meaning === 'released' ? v.goLiveDate : null,
        comment: v.comment.trim(),
        password: v.password,
      })
      .subscribe({
        next: (release) => {
          this.busy.set(false);
          this.form.reset();
          this.signed.emit(release);
        },
        error: (err: ApiError) => {
          this.busy.set(false);
          this.problem.set(showApiError(this.form, err));
        },
      });
  }
}
