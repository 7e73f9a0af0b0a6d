import { TestBed } from '@angular/core/testing';
import type { MailMessage } from '@shared/schemas';
import { httpController, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { MailboxPage } from './mailbox-page';

const mail = (id: number, subject: string, text: string): MailMessage => ({
  id, from: 'parallax@valeharbor.example', to: ['new@valeharbor.example'], subject, text, receivedAt: '2026-03-10T14:00:00Z',
});

async function setUp(messages: MailMessage[]) {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const fixture = TestBed.createComponent(MailboxPage);
  httpController().expectOne({ method: 'GET', url: '/api/v1/mailbox' }).flush(messages);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, el, body: () => el.querySelector('[data-testid="mail-body"]') as HTMLElement };
}

describe('MailboxPage', () => {
  afterEach(() => httpController().verify());

  it('opens the newest message and makes its link clickable', async () => {
    const { body } = await setUp([
      mail(2, 'Your Parallax invitation', 'Choose a password here: http://127.0.0.1:3100/set-password/abcdefghijklmnopqrstu\nThanks.'),
      mail(1, 'Older', 'Nothing'),
    ]);
    const link = body().querySelector('a') as HTMLAnchorElement;
    expect(link.getAttribute('href')).toBe('http://127.0.0.1:3100/set-password/abcdefghijklmnopqrstu');
    expect(body().textContent).toContain('Choose a password here:');
    expect(body().textContent).toContain('Thanks.');
  });

  it("tells when each message arrived in the laboratory's zone, zone named", async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(['admin']))] });
    await restoreSession();
    const fixture = TestBed.createComponent(MailboxPage);
    httpController().expectOne('/api/v1/mailbox').flush([{ ...mail(1, 'Invitation', 'Hello'), receivedAt: '2026-07-10T14:00:00Z' }]);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid="mail-1"]')?.textContent).toContain('2026-07-10 15:00 Europe/Lisbon (UTC+01:00)');
    expect(el.querySelector('[data-testid="mail-received"]')?.textContent).toBe('2026-07-10 15:00:00 Europe/Lisbon (UTC+01:00)');
  });

  it('shows markup in a message as text, never as HTML', async () => {
    const { body } = await setUp([mail(1, 'Odd', '<img src=x onerror="alert(1)"> <b>bold</b>')]);
    expect(body().querySelector('img, b')).toBeNull();
    expect(body().textContent).toBe('<img src=x onerror="alert(1)"> <b>bold</b>');
  });

  it('shows the message the user picks from the list', async () => {
    const { fixture, el, body } = await setUp([mail(2, 'Newest', 'first text'), mail(1, 'Older', 'second text')]);
    (el.querySelector('[data-testid="mail-1"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(body().textContent).toBe('second text');
  });

  it('asks the server again on Refresh and shows what arrived', async () => {
    const { fixture, el } = await setUp([]);
    expect(el.textContent).toContain('No e-mails have been sent yet.');
    (el.querySelector('[data-testid="mailbox-refresh"]') as HTMLButtonElement).click();
    httpController().expectOne('/api/v1/mailbox').flush([mail(3, 'Fresh', 'hello')]);
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="mail-reader"] h2')?.textContent).toBe('Fresh');
  });
});
