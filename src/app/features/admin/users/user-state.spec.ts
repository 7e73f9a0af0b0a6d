import type { User } from '@shared/schemas';
import { userState } from './user-state';

const base: User = {
  id: 1, name: 'Ada', email: 'ada@valeharbor.example', roles: ['technologist'], active: true, hasPassword: true,
  failedSignIns: 0, lockedUntil: null, createdAt: '2026-01-01T00:00:00Z',
};
const now = new Date('2026-03-10T14:00:00Z');

describe('userState', () => {
  it('calls a user with a password and no lock active', () => {
    expect(userState(base, now, 'UTC')).toEqual({ kind: 'active', text: 'Active' });
  });

  it('says an invited user has no password yet', () => {
    expect(userState({ ...base, hasPassword: false }, now, 'UTC').text).toBe('Invited — no password yet');
  });

  it('tells the end of a running lock in the laboratory’s time zone', () => {
    const locked = { ...base, lockedUntil: '2026-03-10T14:20:00Z' };
    expect(userState(locked, now, 'UTC')).toEqual({ kind: 'locked', text: 'Locked until 2026-03-10 14:20 UTC (UTC+00:00)' });
    expect(userState(locked, now, 'America/New_York').text).toBe('Locked until 2026-03-10 10:20 America/New_York (UTC−04:00)');
  });

  it('treats a lock that has run out as no lock', () => {
    expect(userState({ ...base, lockedUntil: '2026-03-10T13:59:00Z' }, now, 'UTC').kind).toBe('active');
  });

  it('puts deactivation before a lock or a missing password', () => {
    const user = { ...base, active: false, hasPassword: false, lockedUntil: '2026-03-10T15:00:00Z' };
    expect(userState(user, now, 'UTC')).toEqual({ kind: 'deactivated', text: 'Deactivated' });
  });
});
