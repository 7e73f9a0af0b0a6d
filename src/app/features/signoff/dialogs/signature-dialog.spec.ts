import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { SignatureData, SignatureDialog } from './signature-dialog';

async function open(kind: SignatureData['kind'] = 'signoff') {
  const close = jest.fn();
  TestBed.configureTestingModule({
    providers: [
      ...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['director'], 'Dr Mara Quist')),
      { provide: MAT_DIALOG_DATA, useValue: { kind, studyId: 12, title: 'Glucose: line 2 against line 1' } satisfies SignatureData },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  await restoreSession();
  const fixture = TestBed.createComponent(SignatureDialog);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const input = (id: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
  const sign = async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="sign-confirm"]' }))).click();
    await fixture.whenStable();
  };
  const choose = async (meaning: 'accepted' | 'not-accepted') =>
    (await loader.getHarness(MatRadioGroupHarness)).checkRadioButton({ selector: `[data-testid="meaning-${meaning}"]` });
  const text = (selector: string) => el.querySelector(selector)?.textContent?.trim() ?? '';
  return { fixture, el, close, input, sign, choose, text, loader };
}

describe('SignatureDialog (sign-off)', () => {
  afterEach(() => httpController().verify());

  it('offers the two meanings in words and says what signing binds', async () => {
    const { el, text } = await open();
    expect(el.textContent).toContain('Accepted for patient testing');
    expect(el.textContent).toContain('Not accepted for patient testing');
    expect(text('[data-testid="sign-binding"]')).toMatch(/binds your name, the meaning you choose and the time of signing to this exact record/);
    expect(text('[data-testid="sign-binding"]')).toContain('cannot be undone');
    expect(el.textContent).toContain('Dr Mara Quist');
  });

  it('refuses to sign without a meaning, and sends nothing', async () => {
    const { input, sign, text, close } = await open();
    await (await input('sign-password')).setValue('parallax-demo');
    await sign();
    httpController().expectNone('/api/v1/studies/12/sign');
    expect(text('[data-testid="meaning-error"]')).toBe('Choose accepted or not accepted.');
    expect(close).not.toHaveBeenCalled();
  });

  it('refuses to sign without the password, and sends nothing', async () => {
    const { sign, choose, text, close } = await open();
    await choose('accepted');
    await sign();
    httpController().expectNone('/api/v1/studies/12/sign');
    expect(text('[data-testid="password-error"]')).toBe('Your password is required.');
    expect(close).not.toHaveBeenCalled();
  });

  it('sends the meaning, the comment and the password, and closes with the signed study', async () => {
    const { input, sign, choose, close } = await open();
    await choose('not-accepted');
    await (await input('sign-comment')).setValue('  Bias exceeds the goal at 11.1 mmol/L  ');
    await (await input('sign-password')).setValue('parallax-demo');
    await sign();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/sign' });
    expect(req.request.body).toEqual({ meaning: 'not-accepted', comment: 'Bias exceeds the goal at 11.1 mmol/L', password: 'parallax-demo' });
    req.flush({ id: 12, state: 'signed' });
    expect(close).toHaveBeenCalledWith({ id: 12, state: 'signed' });
  });

  it('shows the server’s wrong-password issue on the password field and stays open', async () => {
    const { fixture, input, sign, choose, text, close } = await open();
    await choose('accepted');
    await (await input('sign-password')).setValue('not-my-password');
    await sign();
    httpController().expectOne('/api/v1/studies/12/sign').flush(
      apiError('The password is wrong; the signature was not made', [{ path: 'password', message: 'The password is wrong' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(text('[data-testid="password-error"]')).toBe('The password is wrong');
    expect(text('[data-testid="banner"] span')).toBe('The password is wrong; the signature was not made');
    expect(close).not.toHaveBeenCalled();
  });

  it('says in words why another director must sign, and that a locked account cannot', async () => {
    const { fixture, input, sign, choose, text } = await open();
    await choose('accepted');
    await (await input('sign-password')).setValue('parallax-demo');
    await sign();
    const segregation = 'You entered rows of this study, so another director must sign it (segregation of duties)';
    httpController().expectOne('/api/v1/studies/12/sign').flush(apiError(segregation), { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(text('[data-testid="banner"] span')).toBe(segregation);
    await sign();
    const locked = 'Your account is locked after repeated wrong passwords; ask an administrator to unlock it';
    httpController().expectOne('/api/v1/studies/12/sign').flush(apiError(locked), { status: 423, statusText: 'Locked' });
    await fixture.whenStable();
    expect(text('[data-testid="banner"] span')).toBe(locked);
  });
});

describe('SignatureDialog (plan approval)', () => {
  afterEach(() => httpController().verify());

  it('asks no meaning and sends the comment and password to the plan approval', async () => {
    const { el, input, sign, close, loader } = await open('plan');
    expect(el.textContent).toContain('Approve the plan');
    expect(await loader.getAllHarnesses(MatRadioGroupHarness)).toHaveLength(0);
    await (await input('sign-password')).setValue('parallax-demo');
    await sign();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/plan-approval' });
    expect(req.request.body).toEqual({ comment: '', password: 'parallax-demo' });
    req.flush({ id: 12, state: 'draft' });
    expect(close).toHaveBeenCalledWith({ id: 12, state: 'draft' });
  });
});
