/** Five failed sign-ins (or wrong signing passwords) in a row lock an account for 15 minutes. */
export const MAX_FAILURES = 5;
export const LOCK_MINUTES = 15;

export const isLocked = (lockedUntil: Date | null, now = new Date()): boolean => !!lockedUntil && lockedUntil > now;

export function afterFailure(failedSignIns: number, now = new Date()): { failedSignIns: number; lockedUntil: Date | null } {
  const failures = failedSignIns + 1;
  return failures >= MAX_FAILURES
    ? { failedSignIns: failures, lockedUntil: new Date(now.getTime() + LOCK_MINUTES * 60_000) }
    : { failedSignIns: failures, lockedUntil: null };
}
