import { formatZoned, zoneOffset, zonedDay } from './zoned-time';

describe('formatZoned', () => {
  it('shows summer time in Lisbon one hour after UTC and names the zone', () => {
    expect(formatZoned('2026-07-01T12:00:00Z', 'Europe/Lisbon')).toBe('1 Jul 2026, 13:00 (Europe/Lisbon, GMT+01:00)');
  });

  it('shows winter time in Lisbon as UTC itself', () => {
    expect(formatZoned('2026-01-15T08:05:00Z', 'Europe/Lisbon')).toBe('15 Jan 2026, 08:05 (Europe/Lisbon, GMT+00:00)');
  });

  it('moves the date when the zone is behind UTC', () => {
    expect(formatZoned('2026-03-01T02:30:00Z', 'America/Chicago')).toBe('28 Feb 2026, 20:30 (America/Chicago, GMT-06:00)');
  });

  it('adds seconds when asked, as a signature needs', () => {
    expect(formatZoned('2026-07-01T12:00:09.400Z', 'Asia/Kolkata', { seconds: true })).toBe('1 Jul 2026, 17:30:09 (Asia/Kolkata, GMT+05:30)');
  });

  it('leaves the zone out for a table that names it in its header', () => {
    expect(formatZoned('2026-07-01T12:00:00Z', 'Europe/Lisbon', { zone: false })).toBe('1 Jul 2026, 13:00');
  });

  it('falls back to UTC for a zone it does not know, and says so', () => {
    expect(formatZoned('2026-07-01T12:00:00Z', 'Mars/Olympus')).toBe('1 Jul 2026, 12:00 (UTC, GMT+00:00)');
  });

  it('gives nothing for a missing or unreadable time', () => {
    expect(formatZoned(null, 'UTC')).toBe('');
    expect(formatZoned('yesterday', 'UTC')).toBe('');
  });
});

describe('zoneOffset', () => {
  it('writes UTC as GMT+00:00', () => {
    expect(zoneOffset(new Date('2026-07-01T00:00:00Z'), 'UTC')).toBe('GMT+00:00');
  });
});

describe('zonedDay', () => {
  it('gives the calendar day in the zone', () => {
    expect(zonedDay(new Date('2026-03-01T02:30:00Z'), 'America/Chicago')).toBe('2026-02-28');
    expect(zonedDay(new Date('2026-03-01T02:30:00Z'), 'Europe/Lisbon')).toBe('2026-03-01');
  });
});
