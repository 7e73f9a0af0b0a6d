import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from './app-error';
import { readCookie } from './cookies';

const COOKIE = 'XSRF-TOKEN';
const HEADER = 'x-xsrf-token';
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Angular's XSRF convention as a signed double-submit token: the server sets a readable cookie
 * XSRF-TOKEN = random.hmac(random) on any GET; every POST, PUT, PATCH and DELETE must send the same
 * value in the X-XSRF-TOKEN header, and the signature must be ours. A page on another site can
 * neither read the cookie nor set the header.
 */
export function xsrfProtection(secret: string, secure: boolean): RequestHandler {
  const sign = (nonce: string) => createHmac('sha256', secret).update(nonce).digest('base64url');
  const valid = (token: string | undefined) => {
    if (!token) return false;
    const [nonce, mac] = token.split('.');
    if (!nonce || !mac) return false;
    const expected = Buffer.from(sign(nonce));
    const given = Buffer.from(mac);
    return expected.length === given.length && timingSafeEqual(expected, given);
  };
  return (req, res, next) => {
    const cookie = readCookie(req.headers.cookie, COOKIE);
    if (SAFE.has(req.method)) {
      if (!valid(cookie)) {
        const nonce = randomBytes(18).toString('base64url');
        res.cookie(COOKIE, `${nonce}.${sign(nonce)}`, { sameSite: 'strict', secure, httpOnly: false, path: '/' });
      }
      return next();
    }
    const header = req.get(HEADER);
    if (!valid(cookie) || header !== cookie) {
      return next(new AppError('forbidden', 'The request lacks a valid XSRF token; reload the page and try again', [
        { path: 'X-XSRF-TOKEN', message: 'missing or does not match the XSRF-TOKEN cookie' },
      ]));
    }
    next();
  };
}
