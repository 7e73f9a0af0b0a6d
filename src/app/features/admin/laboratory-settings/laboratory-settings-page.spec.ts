import { TestBed } from '@angular/core/testing';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { LaboratorySettingsPage } from './laboratory-settings-page';

const LAB = { name: 'Vale Harbor Regional Laboratory', timeZone: 'Europe/Lisbon', planApprovalRequired: false, allowSelfSign: false };

async function setUp() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), ...provideSession(sessionUser(['admin'])), noAnimations] });
  await restoreSession();
  const fixture = TestBed.createComponent(LaboratorySettingsPage);
  httpController().expectOne({ method: 'GET', url: '/api/v1/laboratory' }).flush(LAB);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const q = <T extends HTMLElement>(id: string) => el.querySelector(`[data-testid="${id}"]`) as T;
  const zone = () => q<HTMLInputElement>('lab-time-zone');
  const type = async (value: string) => {
    zone().value = value;
    zone().dispatchEvent(new Event('input'));
    zone().dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  };
  const submit = async () => {
    q<HTMLFormElement>('lab-settings-form').dispatchEvent(new Event('submit'));
    await fixture.whenStable();
  };
  return { fixture, el, q, zone, type, submit };
}

describe('LaboratorySettingsPage', () => {
  afterEach(() => httpController().verify());

  it('shows the laboratory’s settings with both rules explained in plain words', async () => {
    const { el, zone, q } = await setUp();
    expect(zone().value).toBe('Europe/Lisbon');
    expect(el.querySelector('mat-hint')?.textContent).toMatch(/Now there: \d{4}-\d\d-\d\d \d\d:\d\d Europe\/Lisbon \(UTC\+0[01]:00\)/);
    expect(q('lab-settings-name').textContent).toContain('Vale Harbor Regional Laboratory');
    expect(el.textContent).toContain("Specimens can be entered only after a director approved the study's plan.");
    expect(el.textContent).toContain('A director may sign a study whose rows they entered (each such signature is recorded in the history).');
  });

  it('saves the time zone and both rules', async () => {
    const { fixture, q, type, submit } = await setUp();
    await type('America/Chicago');
    expect(q('lab-settings-form').querySelector('mat-hint')?.textContent).toContain('America/Chicago (UTC−0');
    (q('lab-self-sign').querySelector('input') as HTMLInputElement).click();
    await fixture.whenStable();
    await submit();
    const req = httpController().expectOne({ method: 'PUT', url: '/api/v1/laboratory' });
    expect(req.request.body).toEqual({ timeZone: 'America/Chicago', planApprovalRequired: false, allowSelfSign: true });
    req.flush({ ...LAB, timeZone: 'America/Chicago', allowSelfSign: true });
  });

  it('does not send a zone this browser does not know, and says why', async () => {
    const { el, type, submit } = await setUp();
    await type('Mars/Olympus');
    await submit();
    httpController().expectNone('/api/v1/laboratory');
    expect(el.querySelector('mat-error')?.textContent).toContain('Choose a time zone name from the list');
  });

  it('puts the server’s issue on the time zone field', async () => {
    const { fixture, el, submit } = await setUp();
    await submit();
    httpController()
      .expectOne({ method: 'PUT', url: '/api/v1/laboratory' })
      .flush(apiError('The settings are not valid', [{ path: 'timeZone', message: '"Europe/Lisbon" is not a time zone name such as Europe/Lisbon' }]), {
        status: 400, statusText: 'Bad Request',
      });
    await fixture.whenStable();
    expect(el.querySelector('mat-error')?.textContent).toContain('is not a time zone name');
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('The settings are not valid');
  });
});
