import { Pipe, PipeTransform, Signal, computed, inject } from '@angular/core';
import { AuthStore } from '../../core/auth/auth-store';
import { formatZoned } from './zoned-time';

/** The signed-in laboratory's time zone (UTC until the session is known). */
export function labZone(): Signal<string> {
  const auth = inject(AuthStore);
  return computed(() => auth.user()?.laboratory.timeZone ?? 'UTC');
}

/** How a time is written: with the zone named (default), with seconds too, or plain under a header that names the zone. */
export type ZonedStyle = 'zone' | 'seconds' | 'plain';

/** `{{ event.at | zoned: zone() }}`, `{{ sig.signedAt | zoned: zone() : 'seconds' }}`, `{{ s.createdAt | zoned: zone() : 'plain' }}`. */
@Pipe({ name: 'zoned' })
export class ZonedPipe implements PipeTransform {
  transform(iso: string | null | undefined, timeZone: string, style: ZonedStyle = 'zone'): string {
    return formatZoned(iso, timeZone, { seconds: style === 'seconds', zone: style !== 'plain' });
  }
}
