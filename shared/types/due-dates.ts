/**
 * Calendar arithmetic on laboratory days (yyyy-mm-dd) for re-verification due dates, and their words. Shared by
 * the server (due items, the daily reminder) and the client (the Worklist's Due list, the release board).
 */

/** The day `months` calendar months after `day`; a day the month lacks becomes its last (2026-08-31 + 6 → 2027-02-28). */
export function addMonths(day: string, months: number): string {
  const [y, m, d] = day.split('-').map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, last));
  return target.toISOString().slice(0, 10);
}

/** The day `n` days after `day` (before, for negative n). */
export function addDays(day: string, n: number): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + n)).toISOString().slice(0, 10);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const t = (day: string) => { const [y, m, d] = day.split('-').map(Number); return Date.UTC(y, m - 1, d); };
  return Math.round((t(to) - t(from)) / 86_400_000);
}

/** How far ahead a pending item counts as "due soon" (and goes into the daily reminder). */
export const DUE_SOON_DAYS = 30;

export type DueStatus = 'overdue' | 'due-soon' | 'later';

/** Where a pending due date stands on a laboratory day. */
export function dueStatus(dueDate: string, today: string): DueStatus {
  const left = daysBetween(today, dueDate);
  if (left < 0) return 'overdue';
  return left <= DUE_SOON_DAYS ? 'due-soon' : 'later';
}

const days = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`;

/** "overdue by 12 days", "due today", "due in 20 days". */
export function dueWords(dueDate: string, today: string): string {
  const left = daysBetween(today, dueDate);
  if (left < 0) return `overdue by ${days(-left)}`;
  if (left === 0) return 'due today';
  return `due in ${days(left)}`;
}
