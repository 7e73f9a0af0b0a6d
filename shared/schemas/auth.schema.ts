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

/** Why a set-password link was sent: an invitation to a new account, or a reset of a forgotten password. */
export const PasswordLinkPurpose = z.enum(['invitation', 'reset']);
export type PasswordLinkPurpose = z.infer<typeof PasswordLinkPurpose>;

/** GET /api/v1/password-links/:token answers who the link is for, and the zone of its laboratory (the page shows the expiry in it). */
export const PasswordLinkInfo = z.object({ email: z.string(), name: z.string(), expiresAt: z.string(), purpose: PasswordLinkPurpose, timeZone: z.string() });
export type PasswordLinkInfo = z.infer<typeof PasswordLinkInfo>;

/** POST /api/v1/password-resets: "Forgot your password?" asks for a one-time link for an e-mail. */
export const PasswordResetBody = z.object({ email: Email });
export type PasswordResetBody = z.infer<typeof PasswordResetBody>;

/** Its answer (202), the same words whether or not the e-mail has an account. */
export const PasswordResetAnswer = z.object({ message: z.string() });
export type PasswordResetAnswer = z.infer<typeof PasswordResetAnswer>;
/** A reset link works for this long (the answer below says so in words). */
export const RESET_LINK_HOURS = 1;
export const PASSWORD_RESET_ANSWER = 'If an account uses this address, a link is on its way; it works once, for one hour.';

export const TokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'Not a valid link') });

/** POST /api/v1/password-links/:token sets the password once. */
export const SetPasswordBody = z.object({ password: NewPassword });
export type SetPasswordBody = z.infer<typeof SetPasswordBody>;
