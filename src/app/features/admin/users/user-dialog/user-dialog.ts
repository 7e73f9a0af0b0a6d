import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Observable } from 'rxjs';
import type { Role, User } from '@shared/schemas';
import { ApiError } from '../../../../core/http/api-error';
import { showApiError } from '../../../../core/http/form-errors';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FieldErrorPipe } from '../../../../ui/field-error';
import { RolePicker } from '../role-picker/role-picker';
import { UsersStore } from '../users-store';

/** Invite a user (no `user` given) or change an existing user's name and roles. */
@Component({
  selector: 'app-user-dialog',
  templateUrl: './user-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorBanner, FieldErrorPipe, RolePicker],
})
export class UserDialog {
  private readonly store = inject(UsersStore);
  private readonly dialog = inject<MatDialogRef<UserDialog, User>>(MatDialogRef);
  protected readonly user = inject<{ user?: User } | null>(MAT_DIALOG_DATA, { optional: true })?.user ?? null;

  protected readonly form = new FormGroup({
    name: new FormControl(this.user?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    email: new FormControl(
      { value: this.user?.email ?? '', disabled: this.user !== null },
      { nonNullable: true, validators: [Validators.required, Validators.email] },
    ),
    roles: new FormControl<Role[]>(this.user?.roles ?? [], { nonNullable: true, validators: [Validators.required] }),
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected save(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, email, roles } = this.form.getRawValue();
    const request: Observable<User> = this.user
      ? this.store.update(this.user.id, { name: name.trim(), roles })
      : this.store.invite({ name: name.trim(), email: email.trim(), roles });
    this.busy.set(true);
    request.subscribe({
      next: (saved) => this.dialog.close(saved),
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(showApiError(this.form, err));
      },
    });
  }
}
