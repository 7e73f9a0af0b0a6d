import type { User } from '@shared/schemas';
import { laboratoryTime } from '@shared/types/lab-time';

export type UserStateKind = 'active' | 'invited' | 'locked' | 'deactivated';

export interface UserState {
  kind: UserStateKind;
  text: string;
}

/** True while a sign-in lock is still running at `now`. */
export function isLocked(user: User, now: Date): boolean {
  return user.lockedUntil !== null && new Date(user.lockedUntil).getTime() > now.getTime();
}

/**
 * The account's state in words. Deactivation wins over a lock, a lock over a missing password;
 * the lock's end is told in the laboratory's time zone.
 */
export function userState(user: User, now: Date, timeZone: string): UserState {
  if (!user.active) return { kind: 'deactivated', text: 'Deactivated' };
  if (isLocked(user, now)) {
    return { kind: 'locked', text: `Locked until ${laboratoryTime(user.lockedUntil, timeZone)}` };
  }
  if (!user.hasPassword) return { kind: 'invited', text: 'Invited — no password yet' };
  return { kind: 'active', text: 'Active' };
}
