import { Pipe, PipeTransform, Signal, computed, inject } from '@angular/core';
import { laboratoryTime } from '@shared/types/lab-time';
import { AuthStore } from '../core/auth/auth-store';

/** The signed-in laboratory's time zone (UTC until the session is known). */
export function labZone(): Signal<string> {
  const auth = inject(AuthStore);
  return computed(() => auth.user()?.laboratory.timeZone ?? 'UTC');
}

/** How a time is written: with the zone named (default), with seconds too, or plain under a header that names the zone. */
export type ZonedStyle = 'zone' | 'seconds' | 'plain';

/**
 * Every time the client shows, in the laboratory's zone and one form for the whole product (that of
 * `shared/types/lab-time`, which the server's PDFs, e-mails and exports use too):
 * `{{ event.at | zoned: zone() }}` → "2026-07-01 13:00 Europe/Lisbon (UTC+01:00)",
 * `{{ sig.signedAt | zoned: zone() : 'seconds' }}` → "2026-07-01 13:00:09 Europe/Lisbon (UTC+01:00)",
 * `{{ s.createdAt | zoned: zone() : 'plain' }}` → "2026-07-01 13:00" under a header that names the zone.
 */
@Pipe({ name: 'zoned' })
export class ZonedPipe implements PipeTransform {
  transform(iso: string | null | undefined, timeZone: string, style: ZonedStyle = 'zone'): string {
    return laboratoryTime(iso, timeZone, { seconds: style === 'seconds', zone: style !== 'plain' });
  }
}
