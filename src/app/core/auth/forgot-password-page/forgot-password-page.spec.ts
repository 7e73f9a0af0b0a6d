import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { PASSWORD_RESET_ANSWER } from '@shared/schemas';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { ForgotPasswordPage } from './forgot-password-page';

async function setUp(email?: string) {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const fixture = TestBed.createComponent(ForgotPasswordPage);
  if (email) fixture.componentRef.setInput('email', email);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = () => loader.getHarness(MatInputHarness.with({ selector: '[data-testid="email"]' }));
  const send = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Send me a link' }))).click();
  return { fixture, input, send, el: fixture.nativeElement as HTMLElement };
}

describe('ForgotPasswordPage', () => {
  afterEach(() => httpController().verify());

  it('asks for a link for the e-mail and then says the same words whatever the answer hides', async () => {
    const { fixture, input, send, el } = await setUp();
    await (await input()).setValue('tech@valeharbor.example');
    await send();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/password-resets' });
    expect(req.request.body).toEqual({ email: 'tech@valeharbor.example' });
    req.flush({ message: PASSWORD_RESET_ANSWER }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('If an account uses this address, a link is on its way; it works once, for one hour.');
    expect(el.querySelector('form')).toBeNull();
    expect(el.querySelector('a[data-testid="back-to-sign-in"]')?.getAttribute('href')).toBe('/sign-in?email=tech@valeharbor.example');
  });

  it('fills in the e-mail typed on the sign-in page', async () => {
    const { input } = await setUp('lead@valeharbor.example');
    expect(await (await input()).getValue()).toBe('lead@valeharbor.example');
  });

  it('asks for a valid e-mail without calling the server', async () => {
    const { fixture, input, send, el } = await setUp();
    await (await input()).setValue('not-an-address');
    await send();
    await fixture.whenStable();
    httpController().expectNone('/api/v1/password-resets');
    expect(el.textContent).toContain('Enter a valid e-mail address.');
  });

  it('shows the server’s words when there were too many requests, and keeps the form', async () => {
    const { fixture, input, send, el } = await setUp();
    await (await input()).setValue('tech@valeharbor.example');
    await send();
    const words = 'Too many requests for a password link for this e-mail address (at most 3 an hour); wait 58 minutes and try again';
    httpController().expectOne('/api/v1/password-resets').flush(apiError(words), { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain(words);
    expect(el.querySelector('form')).not.toBeNull();
  });
});
