import { Inject, Injectable, Logger, type NestMiddleware } from '@nestjs/common';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { ApiError } from '../common/api-error';
import { sendError } from '../common/all-exceptions.filter';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { SignInLimitRepository } from './sign-in-limit.repository';
import { PgRateLimitStore } from './sign-in-limit.store';

const logger = new Logger('sign-in-limit');

/**
 * Limits failed sign-ins per client address and e-mail (SIGN_IN_RATE_LIMIT,
 * default 10 per 15 minutes): guessing one person's password is slowed down,
 * while colleagues behind the same office address are not locked out by each
 * other. Successful sign-ins are not counted.
 */
@Injectable()
export class SignInLimitMiddleware implements NestMiddleware {
  private readonly limiter: RequestHandler;

  constructor(@Inject(APP_CONFIG) config: AppConfig, repo: SignInLimitRepository) {
    const { limit, windowMs } = config.signInRateLimit;
    this.limiter = rateLimit({
      windowMs,
      limit,
      store: new PgRateLimitStore(repo),
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-7',
      legacyHeaders: false,
      keyGenerator: (req) => {
        const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
        return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
      },
      handler: (req, res, _next, options) => {
        const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
        const minutes = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + options.windowMs) - Date.now()) / 60_000));
        sendError(
          new ApiError('RATE_LIMITED', `Too many failed sign-ins for this e-mail from your address. Wait about ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or ask an admin to reset your password.`),
          req,
          res,
          logger,
        );
      },
    });
  }

  use(req: Request, res: Response, next: NextFunction): void {
    this.limiter(req, res, next);
  }
}
