import type { Analyte, Instrument, MailMessage, Role, User } from '@shared/schemas';
import type { analytes, instruments, mailMessages, users } from '../db/schema';

/** Database rows → the API's shapes (never the password hash). */
export const userView = (u: typeof users.$inferSelect): User => ({
  id: u.id,
  name: u.name,
  email: u.email,
  roles: u.roles as Role[],
  active: u.active,
  hasPassword: !!u.passwordHash,
  failedSignIns: u.failedSignIns,
  lockedUntil: u.lockedUntil && u.lockedUntil > new Date() ? u.lockedUntil.toISOString() : null,
  createdAt: u.createdAt.toISOString(),
});

export const analyteView = (a: typeof analytes.$inferSelect): Analyte => ({
  id: a.id, name: a.name, unit: a.unit, decimals: a.decimals, decisionLevels: a.decisionLevels,
  allowableBiasAbsolute: a.allowableBiasAbsolute, allowableBiasPercent: a.allowableBiasPercent,
  allowableBiasSource: a.allowableBiasSource, canBeNegative: a.canBeNegative, active: a.active,
});

export const instrumentView = (i: typeof instruments.$inferSelect): Instrument => ({
  id: i.id, name: i.name, model: i.model, serial: i.serial, location: i.location, active: i.active,
});

export const mailView = (m: typeof mailMessages.$inferSelect): MailMessage => ({
  id: m.id, from: m.from, to: m.to, subject: m.subject, text: m.text, receivedAt: m.receivedAt.toISOString(),
});
