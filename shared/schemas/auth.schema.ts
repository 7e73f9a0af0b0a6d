import * as z from 'zod';
import { Email, NewPassword } from './common.schema';
import { Role } from './roles';

export const SignInBody = z.object({ email: Email, password: z.string().min(1, 'Enter your password').max(200) });
export type SignInBody = z.infer<typeof SignInBody>;

export const Laboratory = z.object({ id: z.number(), name: z.string(), timeZone: z.string() });
export type Laboratory = z.infer<typeof Laboratory>;

/** GET /api/v1/session: the signed-in user. */
export const SessionUser = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string(),
  roles: z.array(Role),
  laboratory: Laboratory,
});
export type SessionUser = z.infer<typeof SessionUser>;

/** PUT /api/v1/session/password: change one's own password. */
export const ChangePasswordBody = z.object({
  currentPassword: z.string().min(1, 'Enter your current password'),
  newPassword: NewPassword,
});
export type ChangePasswordBody = z.infer<typeof ChangePasswordBody>;

/** GET /api/v1/password-links/:token answers who the link is for. */
export const PasswordLinkInfo = z.object({ email: z.string(), name: z.string(), expiresAt: z.string() });
export type PasswordLinkInfo = z.infer<typeof PasswordLinkInfo>;

export const TokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'Not a valid link') });

/** POST /api/v1/password-links/:token sets the password once. */
export const SetPasswordBody = z.object({ password: NewPassword });
export type SetPasswordBody = z.infer<typeof SetPasswordBody>;
