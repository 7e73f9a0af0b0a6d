import { ChangeDetectionStrategy, Component, forwardRef, signal } from '@angular/core';
import { ControlValueAccessor, NG_VALUE_ACCESSOR } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import type { Role } from '@shared/schemas';
import { ROLE_LABELS, ROLES } from '@shared/schemas/roles';

/** One checkbox per role, as a form control whose value is the chosen roles in ROLES order. */
@Component({
  selector: 'app-role-picker',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatCheckboxModule],
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => RolePicker), multi: true }],
  template: `
    <fieldset class="roles">
      <legend>Roles</legend>
      @for (role of roles; track role) {
        <mat-checkbox
          [checked]="chosen().includes(role)"
          [disabled]="disabled()"
          (change)="toggle(role, $event.checked)"
          (blur)="touched()"
          [attr.data-testid]="'role-' + role"
          >{{ labels[role] }}</mat-checkbox
        >
      }
    </fieldset>
  `,
  styles: `
    .roles {
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
      padding: 4px 12px 8px;
      margin: 0;
    }
    legend {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      padding: 0 4px;
    }
  `,
})
export class RolePicker implements ControlValueAccessor {
  protected readonly roles = ROLES;
  protected readonly labels = ROLE_LABELS;
  protected readonly chosen = signal<readonly Role[]>([]);
  protected readonly disabled = signal(false);
  private onChange: (roles: Role[]) => void = () => undefined;
  protected touched: () => void = () => undefined;

  writeValue(roles: Role[] | null): void {
    this.chosen.set(roles ?? []);
  }

  registerOnChange(fn: (roles: Role[]) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.touched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.disabled.set(disabled);
  }

  protected toggle(role: Role, on: boolean): void {
    const set = new Set(this.chosen());
    if (on) set.add(role);
    else set.delete(role);
    const next = ROLES.filter((r) => set.has(r));
    this.chosen.set(next);
    this.onChange(next);
    this.touched();
  }
}
