import * as z from 'zod';
import { isCalendarDay } from '../types/lab-time';

/** A positive integer id in a route parameter such as /users/:id. */
export const IdParams = z.object({ id: z.coerce.number().int().positive() });
export type IdParams = z.infer<typeof IdParams>;

/** A calendar day, yyyy-mm-dd, that exists (a date filter means the laboratory's day; see shared/types/lab-time). */
export const CalendarDay = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-11-30')
  .refine((text) => !/^\d{4}-\d{2}-\d{2}$/.test(text) || isCalendarDay(text), 'There is no such day; use a date like 2026-11-30');

export const Email = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(200);

/** Password rules: at least 12 characters, not only one repeated character, not a well-known password. */
export const COMMON_PASSWORDS = [
  'password1234', '123456789012', 'qwertyuiopas', 'letmein12345', 'iloveyou1234', 'administrator',
  'welcome12345', 'passwordpassword', 'changeme1234', 'laboratory12',
];
export const NewPassword = z
  .string()
  .min(12, 'Use at least 12 characters')
  .max(200, 'Use at most 200 characters')
  .refine((p) => new Set(p).size > 3, 'Use more than three different characters')
  .refine((p) => !COMMON_PASSWORDS.includes(p.toLowerCase()), 'This password is too common; choose another');

/** `GET /api/v1/health`: whether the database and the analysis queue answer. */
export const HealthReport = z.object({
  status: z.enum(['ok', 'unavailable']),
  database: z.enum(['ok', 'not answering']),
  queue: z.enum(['ok', 'not answering']),
  checkedAt: z.string(),
  /** How late the API's event loop ran timers since the previous health check (ms): a busy loop answers everyone late. */
  eventLoopDelayMs: z.object({ p50: z.number(), p99: z.number(), max: z.number() }),
});
export type HealthReport = z.infer<typeof HealthReport>;
