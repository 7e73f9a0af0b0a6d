import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router } from '@angular/router';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { sessionUser } from '../../../../testing/session-users';
import { Notices } from '../../notify/notices';
import { AuthStore } from '../auth-store';
import { SignInPage } from './sign-in-page';

async function setUp(inputs: { next?: string; email?: string } = {}) {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  const fixture = TestBed.createComponent(SignInPage);
  for (const [key, value] of Object.entries(inputs)) fixture.componentRef.setInput(key, value);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (id: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
  return { fixture, navigate, input, submit, el: fixture.nativeElement as HTMLElement };
}

describe('SignInPage', () => {
  afterEach(() => httpController().verify());

  it('signs in and returns to the page named in ?next', async () => {
    const { input, submit, navigate } = await setUp({ next: '/admin/users' });
    await (await input('email')).setValue('admin@valeharbor.example');
    await (await input('password')).setValue('parallax-demo');
    await submit();
    httpController().expectOne({ method: 'POST', url: '/api/v1/session' }).flush(sessionUser(['admin']));
    expect(navigate).toHaveBeenCalledWith('/admin/users');
    expect(TestBed.inject(AuthStore).signedIn()).toBe(true);
  });

  it('goes home instead of to another site named in ?next', async () => {
    const { input, submit, navigate } = await setUp({ next: '//evil.example/x' });
    await (await input('email')).setValue('tech@valeharbor.example');
    await (await input('password')).setValue('parallax-demo');
    await submit();
    httpController().expectOne('/api/v1/session').flush(sessionUser(['technologist']));
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('shows the server’s words when sign-in is refused or rate-limited', async () => {
    const { fixture, input, submit, el, navigate } = await setUp();
    await (await input('email')).setValue('tech@valeharbor.example');
    await (await input('password')).setValue('nope');
    await submit();
    httpController().expectOne('/api/v1/session')
      .flush(apiError('E-mail or password is wrong, or the account is locked'), { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('E-mail or password is wrong, or the account is locked');
    await submit();
    httpController().expectOne('/api/v1/session')
      .flush(apiError('Too many sign-in attempts. Try again in 15 minutes.'), { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('Too many sign-in attempts. Try again in 15 minutes.');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('asks for the missing fields without calling the server', async () => {
    const { fixture, submit, el } = await setUp();
    await submit();
    await fixture.whenStable();
    httpController().expectNone('/api/v1/session');
    expect(el.textContent).toContain('Your e-mail is required.');
    expect(el.textContent).toContain('Your password is required.');
  });

  it('links to "Forgot your password?", carrying the e-mail typed so far', async () => {
    const { fixture, input, el } = await setUp();
    const link = () => el.querySelector('a[data-testid="forgot-password"]');
    expect(link()?.textContent).toBe('Forgot your password?');
    expect(link()?.getAttribute('href')).toBe('/forgot-password');
    await (await input('email')).setValue('tech@valeharbor.example');
    await fixture.whenStable();
    expect(link()?.getAttribute('href')).toBe('/forgot-password?email=tech@valeharbor.example');
  });

  it('fills in the e-mail it was given and shows a waiting notice', async () => {
    TestBed.configureTestingModule({ providers: provideTestHttp() });
    TestBed.inject(Notices).post('Your password is set.');
    const fixture = TestBed.createComponent(SignInPage);
    fixture.componentRef.setInput('email', 'new@valeharbor.example');
    await fixture.whenStable();
    const email = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatInputHarness.with({ selector: '[data-testid="email"]' }));
    expect(await email.getValue()).toBe('new@valeharbor.example');
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Your password is set.');
  });
});
