import { randomBytes, timingSafeEqual } from 'node:crypto';
import { Logger } from '@nestjs/common';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { CSRF_COOKIE, CSRF_HEADER } from '@sagline/common/api-types';
import { ApiError } from './api-error';
import { sendError } from './all-exceptions.filter';
import { readCookie } from './cookies';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const logger = new Logger('csrf');

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

export interface CsrfOptions {
  secure: boolean;
}

/**
 * Synchronizer-token CSRF protection (OWASP CSRF Prevention Cheat Sheet):
 * the token lives in the session; a readable cookie hands it to the web
 * client, which echoes it in `X-CSRF-Token` on every state-changing request.
 * A cross-site page can make the browser send cookies, but cannot read them to
 * fill the header. Sign-in is protected too (login CSRF).
 */
export function csrfProtection(options: CsrfOptions): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const token = ensureCsrfToken(req, res, options);
    if (SAFE_METHODS.has(req.method)) return next();
    const sent = req.get(CSRF_HEADER);
    if (!sent || !sameToken(sent, token)) {
      return sendError(
        new ApiError('CSRF_INVALID', `This request lacks a valid CSRF token: send the value of the ${CSRF_COOKIE} cookie in the ${CSRF_HEADER} header (reload the page if it persists).`),
        req,
        res,
        logger,
      );
    }
    next();
  };
}

/** The session's token, created when missing; the cookie is (re)set whenever it differs. */
export function ensureCsrfToken(req: Request, res: Response, options: CsrfOptions): string {
  let token = req.session.csrfToken;
  if (!token) {
    token = randomBytes(32).toString('base64url');
    req.session.csrfToken = token;
  }
  if (readCookie(req, CSRF_COOKIE) !== token) {
    res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'lax', secure: options.secure, path: '/' });
  }
  return token;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
