import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { Notices } from '../../../core/notify/notices';
import { ChangePasswordForm } from './change-password-form';

async function setUp() {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const fixture = TestBed.createComponent(ChangePasswordForm);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (id: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
  const fill = async (current: string, next: string, repeat = next) => {
    await (await input('current-password')).setValue(current);
    await (await input('new-password')).setValue(next);
    await (await input('repeat-password')).setValue(repeat);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Change the password' }))).click();
    await fixture.whenStable();
  };
  return { fixture, input, fill, el: fixture.nativeElement as HTMLElement };
}

describe('ChangePasswordForm', () => {
  afterEach(() => httpController().verify());

  it('sends PUT /api/v1/session/password and clears the form when it is done', async () => {
    const { fill, input } = await setUp();
    await fill('parallax-demo', 'tide tables 2026');
    const req = httpController().expectOne({ method: 'PUT', url: '/api/v1/session/password' });
    expect(req.request.body).toEqual({ currentPassword: 'parallax-demo', newPassword: 'tide tables 2026' });
    req.flush(null, { status: 204, statusText: 'No Content' });
    expect(TestBed.inject(Notices).message()).toBe('Your password is changed.');
    expect(await (await input('current-password')).getValue()).toBe('');
  });

  it('refuses a short new password on its field without calling the server', async () => {
    const { fill, el } = await setUp();
    await fill('parallax-demo', 'short');
    httpController().expectNone('/api/v1/session/password');
    expect(el.textContent).toContain('Use at least 12 characters');
  });

  it('puts the server’s issues on the current and the new password fields', async () => {
    const { fixture, fill, el } = await setUp();
    await fill('wrong-one', 'aaaabbbbcccc-x');
    httpController().expectOne('/api/v1/session/password').flush(
      apiError('Check the fields', [
        { path: 'currentPassword', message: 'The current password is wrong' },
        { path: 'newPassword', message: 'This password was used before' },
      ]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const errors = [...el.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());
    expect(errors).toEqual(['The current password is wrong', 'This password was used before']);
  });
});
