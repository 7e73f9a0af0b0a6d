import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import { fieldError } from '../../ui/field-error';
import { ApiError } from './api-error';
import { showApiError, showIssues } from './form-errors';

function inviteForm() {
  return new FormGroup({
    name: new FormControl('Ada', { nonNullable: true, validators: [Validators.required] }),
    email: new FormControl('ada@x', { nonNullable: true }),
    roles: new FormControl<string[]>([], { nonNullable: true }),
    levels: new FormArray([new FormControl(1), new FormControl(2)]),
  });
}

describe('showIssues', () => {
  it('puts each issue’s message on the control its path names and marks it touched', () => {
    const form = inviteForm();
    showIssues(form, 'Check the fields', [
      { path: 'email', message: 'Enter a valid e-mail address' },
      { path: 'roles', message: 'Choose at least one role' },
    ]);
    expect(form.controls.email.errors).toEqual({ server: 'Enter a valid e-mail address' });
    expect(form.controls.email.touched).toBe(true);
    expect(fieldError(form.controls.roles.errors)).toBe('Choose at least one role');
    expect(form.controls.name.errors).toBeNull();
  });

  it('finds the nearest control for a deeper path such as levels.1 or name.first', () => {
    const form = inviteForm();
    showIssues(form, 'x', [
      { path: 'levels.1', message: 'Not a number' },
      { path: 'name.first', message: 'Too long' },
    ]);
    expect(form.controls.levels.at(1).errors).toEqual({ server: 'Not a number' });
    expect(form.controls.name.errors).toEqual({ server: 'Too long' });
  });

  it('returns the error with every issue that matches no field, for the banner', () => {
    const form = inviteForm();
    const banner = showIssues(form, 'The request was refused.', [
      { path: '', message: 'Change at least one field' },
      { path: 'email', message: 'Taken' },
      { path: 'laboratory', message: 'Unknown laboratory' },
    ]);
    expect(banner).toBe('The request was refused. Change at least one field Unknown laboratory');
  });

  it('lets the field’s own validation take over again once the user edits it', () => {
    const form = inviteForm();
    showApiError(form, new ApiError(400, 'Check', [{ path: 'name', message: 'Already used' }]));
    expect(form.controls.name.invalid).toBe(true);
    form.controls.name.setValue('Ada Lovelace');
    expect(form.controls.name.valid).toBe(true);
  });
});
