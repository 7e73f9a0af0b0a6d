import { FormControl } from '@angular/forms';
import { isTimeZone, knownTimeZones, matchingZones, timeZoneRule } from './time-zones';

describe('time zones', () => {
  it('lists UTC first and the named zones after it', () => {
    const zones = knownTimeZones();
    expect(zones[0]).toBe('UTC');
    expect(zones).toContain('Europe/Lisbon');
    expect(zones.filter((z) => z === 'UTC')).toHaveLength(1);
  });

  it('finds zones by any part of their name, ignoring case and underscores', () => {
    const zones = ['America/New_York', 'America/Chicago', 'Europe/Lisbon'];
    expect(matchingZones(zones, 'new york')).toEqual(['America/New_York']);
    expect(matchingZones(zones, 'AMERICA')).toEqual(['America/New_York', 'America/Chicago']);
    expect(matchingZones(zones, '')).toEqual(zones);
    expect(matchingZones(zones, 'america', 1)).toEqual(['America/New_York']);
  });

  it('accepts a real zone and refuses a made-up or empty one, in words', () => {
    expect(isTimeZone('Asia/Kolkata')).toBe(true);
    expect(isTimeZone('Mars/Olympus')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(timeZoneRule(new FormControl('Mars/Olympus'))).toEqual({ rule: 'Choose a time zone name from the list, such as Europe/Lisbon.' });
    expect(timeZoneRule(new FormControl('Europe/Lisbon'))).toBeNull();
  });
});
