import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router } from '@angular/router';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { Notices } from '../../notify/notices';
import { SetPasswordPage } from './set-password-page';

const TOKEN = 'tok_abcdefghijklmnopqrstuvwxyz';
const LINK_URL = `/api/v1/password-links/${TOKEN}`;

async function setUp() {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  const fixture = TestBed.createComponent(SetPasswordPage);
  fixture.componentRef.setInput('token', TOKEN);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (id: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, loader, input, el, navigate };
}

describe('SetPasswordPage', () => {
  afterEach(() => httpController().verify());

  it('says plainly when the link is unknown or expired', async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne(LINK_URL).flush(apiError('Not found'), { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(el.textContent).toContain('This link is not valid or has expired; ask for a new one with “Forgot your password?” on the sign-in page, or ask your administrator.');
    expect(el.querySelector('form')).toBeNull();
  });

  it("tells the link's expiry in the zone of the laboratory the link belongs to, zone named", async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne(LINK_URL).flush({
      email: 'new@valeharbor.example', name: 'Nia New', expiresAt: '2026-07-13T10:00:00Z', purpose: 'invitation', timeZone: 'America/Halifax',
    });
    await fixture.whenStable();
    expect(el.textContent).toContain('This link works once, until 2026-07-13 07:00 America/Halifax (UTC−03:00).');
  });

  it('sets the password once and sends the user to sign in with their e-mail filled in', async () => {
    const { fixture, loader, input, el, navigate } = await setUp();
    httpController().expectOne(LINK_URL).flush({ email: 'new@valeharbor.example', name: 'Nia New', expiresAt: '2026-03-13T10:00:00Z' });
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="link-for"]')?.textContent).toContain('Nia New (new@valeharbor.example)');
    await (await input('new-password')).setValue('harbor lights at dusk');
    await (await input('repeat-password')).setValue('harbor lights at dusk');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save the password' }))).click();
    const req = httpController().expectOne({ method: 'POST', url: LINK_URL });
    expect(req.request.body).toEqual({ password: 'harbor lights at dusk' });
    req.flush(null, { status: 204, statusText: 'No Content' });
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { email: 'new@valeharbor.example' } });
    expect(TestBed.inject(Notices).message()).toContain('Your password is set.');
  });

  it('asks for a new password when the link is a reset link', async () => {
    const { fixture, el } = await setUp();
    httpController().expectOne(LINK_URL).flush({
      email: 'tech@valeharbor.example', name: 'Tomas Reyes', expiresAt: '2026-07-13T10:00:00Z', purpose: 'reset', timeZone: 'UTC',
    });
    await fixture.whenStable();
    expect(el.querySelector('h1')?.textContent).toBe('Choose a new password');
    expect(el.querySelector('form')).not.toBeNull();
  });

  it('applies the server’s password rules before sending, and checks the repetition', async () => {
    const { fixture, loader, input, el } = await setUp();
    httpController().expectOne(LINK_URL).flush({ email: 'n@valeharbor.example', name: 'N', expiresAt: '2026-03-13T10:00:00Z' });
    await fixture.whenStable();
    await (await input('new-password')).setValue('password1234');
    await (await input('repeat-password')).setValue('password12345');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save the password' }))).click();
    await fixture.whenStable();
    httpController().expectNone({ method: 'POST', url: LINK_URL });
    expect(el.textContent).toContain('This password is too common; choose another');
    expect(el.textContent).toContain('The two passwords are not the same.');
  });
});
