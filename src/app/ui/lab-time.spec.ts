import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideTestHttp } from '../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../testing/session-users';
import { ZonedPipe, labZone } from './lab-time';

@Component({
  template: `<span id="zone">{{ at() | zoned: zone() }}</span><span id="seconds">{{ at() | zoned: zone() : 'seconds' }}</span><span id="plain">{{ at() | zoned: zone() : 'plain' }}</span>`,
  imports: [ZonedPipe],
})
class Times {
  readonly zone = labZone();
  readonly at = signal<string | null>('2026-03-29T22:30:05Z');
}

async function render(signedIn: boolean) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(signedIn ? sessionUser(['quality']) : null)] });
  await restoreSession();
  const fixture = TestBed.createComponent(Times);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, text: (id: string) => el.querySelector(`#${id}`)?.textContent };
}

describe('the zoned pipe', () => {
  it("writes a time in the signed-in laboratory's zone in the one form of the product, zone and offset named", async () => {
    // Lisbon moved to summer time that morning: 22:30 UTC is 23:30 there, still the 29th.
    const { text } = await render(true);
    expect(text('zone')).toBe('2026-03-29 23:30 Europe/Lisbon (UTC+01:00)');
    expect(text('seconds')).toBe('2026-03-29 23:30:05 Europe/Lisbon (UTC+01:00)');
    expect(text('plain')).toBe('2026-03-29 23:30');
  });

  it('writes UTC, named, until the session is known', async () => {
    const { text } = await render(false);
    expect(text('zone')).toBe('2026-03-29 22:30 UTC (UTC+00:00)');
  });

  it('writes nothing for a missing time', async () => {
    const { fixture, text } = await render(true);
    fixture.componentInstance.at.set(null);
    await fixture.whenStable();
    expect(text('zone')).toBe('');
  });
});
