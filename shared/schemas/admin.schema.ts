import * as z from 'zod';
import { Email } from './common.schema';
import { Role } from './roles';

export const User = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string(),
  roles: z.array(Role),
  active: z.boolean(),
  hasPassword: z.boolean(),
  failedSignIns: z.number(),
  lockedUntil: z.string().nullable(),
  createdAt: z.string(),
});
export type User = z.infer<typeof User>;

const Roles = z.array(Role).min(1, 'Choose at least one role').refine((r) => new Set(r).size === r.length, 'A role is listed twice');

/** POST /api/v1/users: invite by e-mail; a one-time set-password link is mailed. */
export const InviteUserBody = z.object({ name: z.string().trim().min(1, 'Enter a name').max(120), email: Email, roles: Roles });
export type InviteUserBody = z.infer<typeof InviteUserBody>;

/** PATCH /api/v1/users/:id */
export const UpdateUserBody = z
  .object({ name: z.string().trim().min(1, 'Enter a name').max(120), roles: Roles, active: z.boolean() })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'Change at least one field');
export type UpdateUserBody = z.infer<typeof UpdateUserBody>;

const finite = (field: string) => z.number({ error: `${field} must be a number` }).finite();

export const AnalyteBody = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120),
    unit: z.string().trim().min(1, 'Enter a unit').max(30),
    decimals: z.number().int('Decimals must be a whole number').min(0).max(6),
    decisionLevels: z.array(finite('A decision level')).max(10, 'At most 10 decision levels'),
    allowableBiasAbsolute: finite('Allowable bias').positive('Allowable bias must be above 0').nullable(),
    allowableBiasPercent: finite('Allowable bias %').positive('Allowable bias % must be above 0').max(100).nullable(),
    allowableBiasSource: z.string().trim().max(500),
    canBeNegative: z.boolean(),
    active: z.boolean(),
  })
  .superRefine((a, ctx) => {
    if (a.allowableBiasAbsolute === null && a.allowableBiasPercent === null)
      ctx.addIssue({ code: 'custom', path: ['allowableBiasAbsolute'], message: 'Give an allowable bias (absolute, percent or both)' });
    if (!a.allowableBiasSource)
      ctx.addIssue({ code: 'custom', path: ['allowableBiasSource'], message: 'Name the source of the allowable bias' });
  });
export type AnalyteBody = z.infer<typeof AnalyteBody>;
export type Analyte = AnalyteBody & { id: number };

export const InstrumentBody = z.object({
  name: z.string().trim().min(1, 'Enter a name').max(120),
  model: z.string().trim().max(200),
  serial: z.string().trim().max(100),
  location: z.string().trim().max(200),
  active: z.boolean(),
});
export type InstrumentBody = z.infer<typeof InstrumentBody>;
export type Instrument = InstrumentBody & { id: number };

export const MailMessage = z.object({
  id: z.number(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  receivedAt: z.string(),
});
export type MailMessage = z.infer<typeof MailMessage>;

export const MailboxQuery = z.object({ to: z.string().max(200).optional() });
