import { ValidatorFn } from '@angular/forms';

/** The IANA time zone names this browser knows, e.g. "Europe/Lisbon" (UTC first). */
export function knownTimeZones(): string[] {
  const names = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
  return ['UTC', ...names.filter((n) => n !== 'UTC')];
}

/** Up to `limit` zone names containing every word typed, in any case ("lis" finds Europe/Lisbon). */
export function matchingZones(zones: readonly string[], typed: string, limit = 50): string[] {
  const words = typed.toLowerCase().replace(/[_/]/g, ' ').split(/\s+/).filter(Boolean);
  const hits = zones.filter((zone) => {
    const text = zone.toLowerCase().replace(/[_/]/g, ' ');
    return words.every((word) => text.includes(word));
  });
  return hits.slice(0, limit);
}

/** True when Intl can format times in the zone (the server makes the same test). */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return name.trim().length > 0;
  } catch {
    return false;
  }
}

export const timeZoneRule: ValidatorFn = (control) =>
  isTimeZone(String(control.value ?? '')) ? null : { rule: 'Choose a time zone name from the list, such as Europe/Lisbon.' };
