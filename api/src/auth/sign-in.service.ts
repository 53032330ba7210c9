import { Inject, Injectable } from '@nestjs/common';
import type { Request, Response } from 'express';
import { ApiError } from '../common/api-error';
import { ensureCsrfToken } from '../common/csrf.middleware';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { AUTHENTICATOR, type Authenticator } from './authenticator';
import type { SessionUser } from './session-user';

/** Opens and closes sessions through passport (which renews the session id: no fixation). */
@Injectable()
export class SignInService {
  constructor(
    @Inject(AUTHENTICATOR) private readonly authenticator: Authenticator,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  signIn(req: Request, res: Response): Promise<SessionUser> {
    return new Promise((resolve, reject) => {
      const handler = this.authenticator.authenticate('local', (err: unknown, user: SessionUser | false) => {
        if (err) return reject(err);
        if (!user) {
          return reject(new ApiError('BAD_CREDENTIALS', 'That e-mail and password do not match an account; check both and try again.'));
        }
        req.logIn(user, (loginErr) => {
          if (loginErr) return reject(loginErr);
          // The session was renewed, and with it the CSRF token.
          ensureCsrfToken(req, res, { secure: this.config.secureCookies });
          resolve(user);
        });
      });
      handler(req, res, (e: unknown) => reject(e ?? new Error('passport did not answer')));
    });
  }

  signOut(req: Request, res: Response): Promise<void> {
    return new Promise((resolve, reject) => {
      if (!req.user) {
        resolve();
        return;
      }
      req.logOut((err) => {
        if (err) return reject(err);
        ensureCsrfToken(req, res, { secure: this.config.secureCookies });
        resolve();
      });
    });
  }
}
