import type { Request, Response } from 'express';
import type { PassportStatic } from 'passport';
import { ChangePasswordBody, PASSWORD_RESET_ANSWER, PasswordResetBody, SetPasswordBody, SignInBody, TokenParams, type PasswordResetAnswer } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf } from './session-user';
import { SignInLimits } from './sign-in-limits';
import type { AppContext } from '../context';
import { AppError } from '../http/app-error';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { changeOwnPassword, describeSession } from './auth.service';
import { describeLink, usePasswordLink } from './password-links';
import { requestPasswordReset } from './password-resets';
import { ResetLimits } from './reset-limits';

const logIn = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
const logOut = (req: Request) =>
  new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));

/** Runs passport-local's strategy (verifySignIn underneath) and resolves with the user. */
const authenticate = (passport: PassportStatic, req: Request, res: Response) =>
  new Promise<Express.User>((resolve, reject) =>
    passport.authenticate('local', { session: false }, (err: unknown, user: Express.User | false) =>
      err ? reject(err) : user ? resolve(user) : reject(new AppError('invalid_request', 'Enter your e-mail and password')),
    )(req, res, reject),
  );

export function authRoutes(ctx: AppContext, passport: PassportStatic): RouteSpec[] {
  const limits = new SignInLimits(ctx.pool, ctx.db, ctx.config.signInRateLimit);
  const resetLimits = new ResetLimits(ctx.pool, ctx.db, ctx.config.passwordResetRateLimit);
  return [
    {
      method: 'get', path: '/session', access: 'public',
      handler: async (req, res) => {
        if (!req.user) throw new AppError('unauthenticated', 'Not signed in');
        res.json(await describeSession(ctx.db, req.user));
      },
    },
    {
      method: 'post', path: '/session', access: 'public',
      handler: async (req, res) => {
        req.body = parseRequest(SignInBody, req.body, 'body');
        const { email } = req.body as SignInBody;
        const address = req.ip ?? '';
        await limits.assertAllowed(address, email);
        const user = await authenticate(passport, req, res).catch(async (err) => {
          if (err instanceof AppError && err.code === 'unauthenticated') await limits.failed(address, email);
          throw err;
        });
        await limits.succeeded(email);
        await logIn(req, user); // passport regenerates the session id here
        res.json(await describeSession(ctx.db, user));
      },
    },
    {
      method: 'delete', path: '/session', access: 'signed-in',
      handler: async (req, res) => {
        const user = req.user!;
        await ctx.db.transaction((tx) => recordAudit(tx, actorOf(user), { action: 'sign-out', entity: 'session', entityId: user.id }));
        await logOut(req);
        req.session.destroy(() => res.status(204).end());
      },
    },
    {
      method: 'put', path: '/session/password', access: 'signed-in',
      handler: async (req, res) => {
        const body = parseRequest(ChangePasswordBody, req.body, 'body');
        await changeOwnPassword(ctx.db, req.user!, body, req.ip ?? '', req.sessionID);
        res.status(204).end();
      },
    },
    {
      // "Forgot your password?": the same 202 and the same words whether or not the e-mail has an account.
      method: 'post', path: '/password-resets', access: 'public', sessionless: true,
      handler: async (req, res) => {
        const { email } = parseRequest(PasswordResetBody, req.body, 'body');
        const address = req.ip ?? '';
        await resetLimits.consume(address, email);
        await requestPasswordReset(ctx, email, address);
        res.status(202).json({ message: PASSWORD_RESET_ANSWER } satisfies PasswordResetAnswer);
      },
    },
    {
      method: 'get', path: '/password-links/:token', access: 'public',
      handler: async (req, res) => {
        const { token } = parseRequest(TokenParams, req.params, 'params');
        res.json(await describeLink(ctx.db, token));
      },
    },
    {
      method: 'post', path: '/password-links/:token', access: 'public',
      handler: async (req, res) => {
        const { token } = parseRequest(TokenParams, req.params, 'params');
        const body = parseRequest(SetPasswordBody, req.body, 'body');
        const email = await usePasswordLink(ctx.db, token, body.password);
        await limits.succeeded(email); // the new password starts with a clean count of failed sign-ins
        res.status(204).end();
      },
    },
  ];
}
