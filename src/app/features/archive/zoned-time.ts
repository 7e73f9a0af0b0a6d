/** Options for formatZoned. */
export interface ZonedOptions {
  /** Show seconds, as a signature's time does. */
  seconds?: boolean;
  /** Name the zone after the time (default); a table that names it in its header leaves it out. */
  zone?: boolean;
}

function validZone(timeZone: string): string {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone });
    return timeZone;
  } catch {
    return 'UTC';
  }
}

/** The zone's offset from UTC at that moment, as "GMT+01:00" (UTC itself as "GMT+00:00"). */
export function zoneOffset(date: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone: validZone(timeZone), timeZoneName: 'longOffset' })
    .formatToParts(date)
    .find((p) => p.type === 'timeZoneName')?.value;
  return !part || part === 'GMT' ? 'GMT+00:00' : part;
}

/**
 * A moment as the laboratory reads it, with the zone named: "1 Jul 2026, 13:00 (Europe/Lisbon, GMT+01:00)".
 * An unknown zone falls back to UTC and says so; an unreadable time gives ''.
 */
export function formatZoned(iso: string | null | undefined, timeZone: string, options: ZonedOptions = {}): string {
  if (!iso) return '';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  const zone = validZone(timeZone);
  const text = new Intl.DateTimeFormat('en-GB', {
    day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone: zone,
    ...(options.seconds ? { second: '2-digit' } : {}),
  }).format(date);
  return options.zone === false ? text : `${text} (${zone}, ${zoneOffset(date, zone)})`;
}

/** The calendar day of a moment in the zone, as yyyy-mm-dd (the form the API's date filters take). */
export function zonedDay(date: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone: validZone(timeZone), year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(date);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}
