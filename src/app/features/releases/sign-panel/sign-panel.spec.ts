import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import type { Release } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { release } from '../release-fixtures.testing';
import { SignPanel } from './sign-panel';

const READY = release({ ready: true, blockers: [], met: 2 });

async function open(input: Release = READY) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['director'], 'Dr Mara Quist'))] });
  await restoreSession();
  const fixture = TestBed.createComponent(SignPanel);
  fixture.componentRef.setInput('release', input);
  const signed: Release[] = [];
  fixture.componentInstance.signed.subscribe((r) => signed.push(r));
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  const field = (id: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }));
  const choose = async (meaning: 'released' | 'not-released') => {
    await (await loader.getHarness(MatRadioGroupHarness)).checkRadioButton({ selector: `[data-testid="release-meaning-${meaning}"]` });
    await fixture.whenStable();
  };
  const sign = async () => {
    (q('sign-release') as HTMLButtonElement).click();
    await fixture.whenStable();
  };
  return { fixture, el, q, field, choose, sign, signed };
}

describe('SignPanel', () => {
  afterEach(() => httpController().verify());

  it('stays closed while a requirement is open, listing what blocks it and who may sign', async () => {
    const { q, el, sign } = await open(release());
    expect(q('release-blockers')?.textContent).toContain('“Precision” has no signed study and is not waived.');
    expect(q('release-who-may-sign')?.textContent).toBe('Any director of the laboratory may sign this release.');
    expect((q('sign-release') as HTMLButtonElement).disabled).toBe(true);
    expect((q('release-password') as HTMLInputElement).disabled).toBe(true);
    expect([...el.querySelectorAll('input[type="radio"]')].every((r) => (r as HTMLInputElement).disabled)).toBe(true);
    await sign();
    httpController().expectNone('/api/v1/releases/7/sign');
  });

  it('stays closed to a director the server does not allow, saying why', async () => {
    const why = 'You started this release, so another director must sign it.';
    const { q } = await open(release({ ready: true, blockers: [], mayISign: { allowed: false, why } }));
    expect(q('release-blockers')).toBeNull();
    expect(q('release-who-may-sign')?.textContent).toBe(why);
    expect((q('sign-release') as HTMLButtonElement).disabled).toBe(true);
  });

  it('opens when every requirement is met, and asks a go-live date for a release for patient testing', async () => {
    const { fixture, q, field, choose, sign, signed } = await open();
    expect(q('release-blockers')).toBeNull();
    expect((q('sign-release') as HTMLButtonElement).disabled).toBe(false);
    expect(q('release-go-live')).toBeNull();
    await choose('released');
    expect(q('release-go-live')).not.toBeNull();
    await (await field('release-password')).setValue('parallax-demo');
    await sign();
    httpController().expectNone('/api/v1/releases/7/sign');
    expect(q('release-go-live-error')?.textContent).toBe('The go-live date is required.');
    await (await field('release-go-live')).setValue('2026-05-11');
    await (await field('release-comment')).setValue('  Both studies within the goals  ');
    await sign();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/sign' });
    expect(req.request.body).toEqual({ meaning: 'released', goLiveDate: '2026-05-11', comment: 'Both studies within the goals', password: 'parallax-demo' });
    req.flush(release({ state: 'released' }));
    await fixture.whenStable();
    expect(signed.map((r) => r.state)).toEqual(['released']);
  });

  it('signs “not released” without a go-live date', async () => {
    const { q, field, choose, sign } = await open();
    await choose('released');
    await choose('not-released');
    expect(q('release-go-live')).toBeNull();
    await (await field('release-password')).setValue('parallax-demo');
    await sign();
    const req = httpController().expectOne('/api/v1/releases/7/sign');
    expect(req.request.body).toEqual({ meaning: 'not-released', goLiveDate: null, comment: '', password: 'parallax-demo' });
    req.flush(release({ state: 'not-released' }));
  });

  it('requires a meaning and the password before sending anything', async () => {
    const { q, sign } = await open();
    await sign();
    httpController().expectNone('/api/v1/releases/7/sign');
    expect(q('release-meaning-error')?.textContent).toBe('Choose released or not released.');
    expect(q('release-password-error')?.textContent).toBe('Your password is required.');
  });

  it('shows a wrong password on its field and a refusal in words', async () => {
    const { fixture, q, field, choose, sign, signed } = await open();
    await choose('not-released');
    await (await field('release-password')).setValue('not-mine');
    await sign();
    httpController().expectOne('/api/v1/releases/7/sign').flush(
      apiError('The password is wrong; the release was not signed', [{ path: 'password', message: 'The password is wrong' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(q('release-password-error')?.textContent).toBe('The password is wrong');
    expect(q('banner')?.textContent).toContain('the release was not signed');
    await sign();
    httpController().expectNone('/api/v1/releases/7/sign');
    await (await field('release-password')).setValue('parallax-demo');
    await sign();
    httpController().expectOne('/api/v1/releases/7/sign').flush(apiError('“Precision” is no longer met: its study was amended'), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(q('banner')?.textContent).toContain('“Precision” is no longer met');
    expect(signed).toEqual([]);
  });
});
