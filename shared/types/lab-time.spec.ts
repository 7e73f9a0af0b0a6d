import { dayStart, isCalendarDay, labDayRange, laboratoryDate, laboratoryTime, nextDay, utcOffset } from './lab-time';

/** True when the filter keeps the instant, as the server's `at >= start AND at < end` does. */
const keeps = (range: { start?: Date; end?: Date }, iso: string): boolean => {
  const t = new Date(iso).getTime();
  return (!range.start || t >= range.start.getTime()) && (!range.end || t < range.end.getTime());
};

describe('laboratoryTime', () => {
  it('writes the local date and time, the zone and the offset in force, summer time included', () => {
    expect(laboratoryTime(new Date('2026-12-02T13:14:00Z'), 'America/Halifax')).toBe('2026-12-02 09:14 America/Halifax (UTC−04:00)');
    expect(laboratoryTime('2026-07-02T13:14:00Z', 'America/Halifax')).toBe('2026-07-02 10:14 America/Halifax (UTC−03:00)');
    expect(laboratoryTime('2026-07-01T12:00:00Z', 'Europe/Lisbon')).toBe('2026-07-01 13:00 Europe/Lisbon (UTC+01:00)');
    expect(laboratoryTime('2026-01-15T08:05:00Z', 'Europe/Lisbon')).toBe('2026-01-15 08:05 Europe/Lisbon (UTC+00:00)');
  });

  it('moves the date across midnight with the zone', () => {
    expect(laboratoryTime(new Date('2026-12-31T23:30:00Z'), 'Asia/Kolkata')).toBe('2027-01-01 05:00 Asia/Kolkata (UTC+05:30)');
    expect(laboratoryTime('2026-03-01T02:30:00Z', 'America/Chicago')).toBe('2026-02-28 20:30 America/Chicago (UTC−06:00)');
  });

  it('writes midnight as 00, not 24', () => {
    expect(laboratoryTime('2026-03-29T00:00:00Z', 'Europe/Lisbon')).toBe('2026-03-29 00:00 Europe/Lisbon (UTC+00:00)');
  });

  it('adds seconds when asked and leaves the zone out under a header that names it', () => {
    expect(laboratoryTime('2026-07-01T12:00:09.400Z', 'Asia/Kolkata', { seconds: true })).toBe('2026-07-01 17:30:09 Asia/Kolkata (UTC+05:30)');
    expect(laboratoryTime('2026-07-01T12:00:00Z', 'Europe/Lisbon', { zone: false })).toBe('2026-07-01 13:00');
  });

  it('writes an unknown zone as UTC and names UTC', () => {
    expect(laboratoryTime('2026-07-01T12:00:00Z', 'Mars/Olympus')).toBe('2026-07-01 12:00 UTC (UTC+00:00)');
  });

  it('gives nothing for a missing or unreadable time', () => {
    expect(laboratoryTime(null, 'UTC')).toBe('');
    expect(laboratoryTime('yesterday', 'UTC')).toBe('');
  });
});

describe('utcOffset and laboratoryDate', () => {
  it('writes the offset with a true minus sign and UTC as +00:00', () => {
    expect(utcOffset(new Date('2026-12-02T00:00:00Z'), 'UTC')).toBe('UTC+00:00');
    expect(utcOffset(new Date('2026-01-02T00:00:00Z'), 'America/New_York')).toBe('UTC−05:00');
    expect(utcOffset(new Date('2026-01-02T00:00:00Z'), 'Asia/Kathmandu')).toBe('UTC+05:45');
  });

  it("gives the calendar day in the laboratory's zone", () => {
    expect(laboratoryDate('2026-03-01T02:30:00Z', 'America/Chicago')).toBe('2026-02-28');
    expect(laboratoryDate('2026-03-01T02:30:00Z', 'Europe/Lisbon')).toBe('2026-03-01');
  });
});

describe('calendar days', () => {
  it('knows real days from look-alikes', () => {
    expect(isCalendarDay('2028-02-29')).toBe(true);
    expect(isCalendarDay('2026-02-29')).toBe(false);
    expect(isCalendarDay('2026-13-01')).toBe(false);
    expect(isCalendarDay('29/03/2026')).toBe(false);
  });

  it('steps to the next day across months and years', () => {
    expect(nextDay('2026-02-28')).toBe('2026-03-01');
    expect(nextDay('2026-12-31')).toBe('2027-01-01');
  });
});

describe('dayStart', () => {
  it("is the laboratory's midnight, with the offset of that day", () => {
    expect(dayStart('2026-07-01', 'Europe/Lisbon').toISOString()).toBe('2026-06-30T23:00:00.000Z');
    expect(dayStart('2026-03-29', 'Europe/Lisbon').toISOString()).toBe('2026-03-29T00:00:00.000Z');
    expect(dayStart('2026-03-30', 'Europe/Lisbon').toISOString()).toBe('2026-03-29T23:00:00.000Z');
    expect(dayStart('2026-03-08', 'America/New_York').toISOString()).toBe('2026-03-08T05:00:00.000Z');
    expect(dayStart('2026-03-09', 'America/New_York').toISOString()).toBe('2026-03-09T04:00:00.000Z');
    expect(dayStart('2026-11-01', 'America/New_York').toISOString()).toBe('2026-11-01T04:00:00.000Z');
    expect(dayStart('2026-11-02', 'America/New_York').toISOString()).toBe('2026-11-02T05:00:00.000Z');
  });

  it('starts a day whose midnight summer time skips at the moment the clocks jump', () => {
    // Chile moves from UTC−04:00 to UTC−03:00 at local midnight on 2026-09-06: the day begins at 01:00.
    expect(dayStart('2026-09-06', 'America/Santiago').toISOString()).toBe('2026-09-06T04:00:00.000Z');
    expect(laboratoryTime(dayStart('2026-09-06', 'America/Santiago'), 'America/Santiago')).toBe('2026-09-06 01:00 America/Santiago (UTC−03:00)');
  });

  it('refuses text that is not a day', () => {
    expect(() => dayStart('2026-02-30', 'UTC')).toThrow(RangeError);
  });
});

describe("labDayRange: date filters count the laboratory's days", () => {
  it('on the day Lisbon moves to summer time, "to 2026-03-29" keeps 23:30 local and leaves out 00:30 the next local day', () => {
    const range = labDayRange({ to: '2026-03-29' }, 'Europe/Lisbon');
    expect(range.end?.toISOString()).toBe('2026-03-29T23:00:00.000Z');
    expect(keeps(range, '2026-03-29T22:30:00Z')).toBe(true); // 23:30 WEST on the 29th
    expect(keeps(range, '2026-03-29T23:30:00Z')).toBe(false); // 00:30 WEST on the 30th, though still the 29th in UTC
  });

  it('on the day New York moves to summer time, "to 2026-03-08" keeps 23:30 local, which is already the next UTC day', () => {
    const range = labDayRange({ from: '2026-03-08', to: '2026-03-08' }, 'America/New_York');
    expect(keeps(range, '2026-03-09T03:30:00Z')).toBe(true); // 23:30 EDT on the 8th
    expect(keeps(range, '2026-03-09T04:30:00Z')).toBe(false); // 00:30 EDT on the 9th
    expect(keeps(range, '2026-03-08T05:30:00Z')).toBe(true); // 00:30 EST on the 8th
    expect(keeps(range, '2026-03-08T04:30:00Z')).toBe(false); // 23:30 EST on the 7th, already the 8th in UTC
  });

  it('leaves an open end open', () => {
    expect(labDayRange({}, 'Europe/Lisbon')).toEqual({});
    expect(labDayRange({ from: '2026-01-10' }, 'UTC')).toEqual({ start: new Date('2026-01-10T00:00:00Z') });
  });
});
