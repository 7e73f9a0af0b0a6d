/**
 * Time as the laboratory reads it. The laboratory's zone (laboratories.time_zone) governs every time
 * Parallax shows, prints, mails or exports, and every date filter; this module is the one way both
 * sides write a moment and turn a calendar day into instants:
 *
 *   "2026-12-02 09:14 America/Halifax (UTC−04:00)"
 *
 * the local date and time, the zone's name and the offset in force at that moment (summer time
 * included, from the ICU data of Intl). Dates are yyyy-mm-dd everywhere, as in the date fields.
 */

/** How a moment is written. */
export interface LabTimeOptions {
  /** Show seconds, as a signature's or a re-check's time does. */
  seconds?: boolean;
  /** Name the zone and offset after the time (default); a table that names the zone in its header leaves it out. */
  zone?: boolean;
}

/** A moment: a Date, an ISO 8601 instant or milliseconds since 1970. */
export type Moment = Date | string | number;

const zones = new Map<string, string>();
/** The zone itself when Intl knows it, else UTC (a time is never written in an unknown zone). */
export function knownZone(timeZone: string): string {
  let known = zones.get(timeZone);
  if (known === undefined) {
    try {
      new Intl.DateTimeFormat('en-US', { timeZone });
      known = timeZone;
    } catch {
      known = 'UTC';
    }
    zones.set(timeZone, known);
  }
  return known;
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function wallClock(at: Date, timeZone: string): Record<'year' | 'month' | 'day' | 'hour' | 'minute' | 'second', string> {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23',
    });
    formatters.set(timeZone, f);
  }
  const parts = f.formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes): string => parts.find((p) => p.type === type)?.value ?? '00';
  return { year: part('year'), month: part('month'), day: part('day'), hour: part('hour') === '24' ? '00' : part('hour'), minute: part('minute'), second: part('second') };
}

function toDate(at: Moment | null | undefined): Date | null {
  if (at === null || at === undefined || at === '') return null;
  const date = at instanceof Date ? at : new Date(at);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** The offset in force at that moment: "UTC+05:30", "UTC−04:00" (a true minus sign), "UTC+00:00". */
export function utcOffset(at: Date, timeZone: string): string {
  const minutes = offsetMinutes(at.getTime(), knownZone(timeZone));
  const sign = minutes < 0 ? '\u2212' : '+';
  const abs = Math.abs(minutes);
  return `UTC${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}

/** Minutes the zone's wall clock is ahead of UTC at that instant (negative west of Greenwich). */
function offsetMinutes(ms: number, timeZone: string): number {
  const whole = Math.floor(ms / 1000) * 1000;
  const w = wallClock(new Date(whole), timeZone);
  const asUtc = Date.UTC(Number(w.year), Number(w.month) - 1, Number(w.day), Number(w.hour), Number(w.minute), Number(w.second));
  return Math.round((asUtc - whole) / 60_000);
}

/**
 * A moment as the laboratory reads it: "2026-12-02 09:14 America/Halifax (UTC−04:00)", with seconds
 * when asked ("… 09:14:07 …"), without the zone under a header that names it ("2026-12-02 09:14").
 * An unknown zone is written as UTC and named so; a missing or unreadable time gives ''.
 */
export function laboratoryTime(at: Moment | null | undefined, timeZone: string, options: LabTimeOptions = {}): string {
  const date = toDate(at);
  if (!date) return '';
  const zone = knownZone(timeZone);
  const w = wallClock(date, zone);
  const text = `${w.year}-${w.month}-${w.day} ${w.hour}:${w.minute}${options.seconds ? `:${w.second}` : ''}`;
  return options.zone === false ? text : `${text} ${zone} (${utcOffset(date, zone)})`;
}

/** The calendar day of a moment in the laboratory's zone, yyyy-mm-dd ('' for a missing or unreadable time). */
export function laboratoryDate(at: Moment | null | undefined, timeZone: string): string {
  const date = toDate(at);
  if (!date) return '';
  const w = wallClock(date, knownZone(timeZone));
  return `${w.year}-${w.month}-${w.day}`;
}

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
/** True for a real calendar day written yyyy-mm-dd (2026-02-29 is not one). */
export function isCalendarDay(text: string): boolean {
  const m = DAY.exec(text);
  if (!m) return false;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return date.getUTCFullYear() === Number(m[1]) && date.getUTCMonth() === Number(m[2]) - 1 && date.getUTCDate() === Number(m[3]);
}

/** The day after a yyyy-mm-dd day. */
export function nextDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}

/**
 * The first instant of a calendar day in the laboratory's zone: its local midnight, or, where summer
 * time skips midnight, the moment the clocks jump (the first instant that is that day).
 * @throws RangeError for text that is not a yyyy-mm-dd calendar day
 */
export function dayStart(day: string, timeZone: string): Date {
  if (!isCalendarDay(day)) throw new RangeError(`dayStart requires a yyyy-mm-dd day, not "${day}"`);
  const zone = knownZone(timeZone);
  const [y, m, d] = day.split('-').map(Number);
  const wall = Date.UTC(y, m - 1, d);
  // The offset at a guess, then at the instant it gives: the two differ only near a change of offset.
  const first = wall - offsetMinutes(wall, zone) * 60_000;
  const second = wall - offsetMinutes(first, zone) * 60_000;
  const onTheDay = [first, second].filter((t) => laboratoryDate(t, zone) === day);
  return new Date(onTheDay.length ? Math.min(...onTheDay) : first);
}

/**
 * A from/to filter in the laboratory's days as instants: from the first instant of `from` (inclusive)
 * to the first instant of the day after `to` (exclusive), so "to 2026-03-29" keeps everything until
 * local midnight, whatever the offset that day.
 */
export function labDayRange(range: { from?: string; to?: string }, timeZone: string): { start?: Date; end?: Date } {
  return {
    ...(range.from ? { start: dayStart(range.from, timeZone) } : {}),
    ...(range.to ? { end: dayStart(nextDay(range.to), timeZone) } : {}),
  };
}
