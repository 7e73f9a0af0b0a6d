/**
 * A moment as the laboratory reads it: "2026-12-02 09:14 America/Halifax (UTC−04:00)". The offset is
 * the one in force at that moment (summer time included), from the ICU data of Node's Intl.
 */
export function laboratoryTime(at: Date, timeZone: string): string {
  const parts = formatter(timeZone).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes): string => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')} ${part('hour')}:${part('minute')} ${timeZone} (${utcOffset(at, timeZone)})`;
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    formatters.set(timeZone, f);
  }
  return f;
}

/** "UTC+05:30", "UTC−04:00", "UTC+00:00". */
export function utcOffset(at: Date, timeZone: string): string {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(at).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
  const match = /GMT([+-])(\d{2}):(\d{2})/.exec(name);
  if (!match) return 'UTC+00:00';
  return `UTC${match[1] === '-' ? '\u2212' : '+'}${match[2]}:${match[3]}`;
}

/** The calendar date only, in the laboratory's zone. */
export function laboratoryDate(at: Date, timeZone: string): string {
  return laboratoryTime(at, timeZone).slice(0, 10);
}
