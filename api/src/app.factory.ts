import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { LogLevel } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import session from 'express-session';
import type { NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { SESSION_COOKIE } from '@sagline/common/api-types';
import { AppModule } from './app.module';
import { AUTHENTICATOR, type Authenticator } from './auth/authenticator';
import { ApiError } from './common/api-error';
import { AllExceptionsFilter } from './common/all-exceptions.filter';
import { csrfProtection } from './common/csrf.middleware';
import { expressErrorHandler } from './common/express-error.handler';
import { requestId } from './common/request-id.middleware';
import { unlessPath } from './common/unless-path';
import { ApiValidationPipe } from './common/validation';
import { serveWebApp } from './common/web-app';
import type { AppConfig } from './config/app-config';
import { AnswerReplay } from './db/answer-replay';
import { SessionStore } from './db/session-store';

/** JSON bodies above this are refused with 413 PAYLOAD_TOO_LARGE (uploads use multipart, not JSON). */
export const JSON_BODY_LIMIT = '1mb';
const SESSION_DAYS = 14;

export interface CreateAppOptions {
  logger?: LogLevel[] | false;
}

/**
 * The configured api, initialised but not listening (main.ts listens; tests
 * hand `getHttpServer()` to supertest). Middleware order matters:
 * request id → helmet → web app files → JSON body → session → passport → CSRF
 * → (errors of all of these in our shape) → Nest routes with the global pipe and filter.
 * In front of all of it, on the server itself, the door that answers a repeated read
 * (db/answer-replay.ts).
 */
export async function createApp(config: AppConfig, options: CreateAppOptions = {}): Promise<NestExpressApplication> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    bodyParser: false,
    abortOnError: false,
    logger: options.logger ?? ['error', 'warn', 'log'],
  });

  // Which client address the rate limit sees and whether `Secure` cookies see HTTPS
  // depend on the proxy in front (TRUST_PROXY; `1` behind one load balancer).
  app.set('trust proxy', config.trustProxy);
  app.disable('x-powered-by');
  app.use(requestId);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          // Plain http on loopback in development: upgrading would break every request.
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
      strictTransportSecurity: config.secureCookies,
    }),
  );
  serveWebApp(app, config.webDist);
  app.useBodyParser('json', { limit: JSON_BODY_LIMIT });

  const authenticator = app.get<Authenticator>(AUTHENTICATOR);
  const sessionMiddleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store: app.get(SessionStore).store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: SESSION_DAYS * 86_400_000, path: '/' },
  });
  // Health checks from a load balancer must not create a session per probe.
  app.use(
    '/api',
    unlessPath('/health', [
      sessionMiddleware,
      // compat off: no legacy `req._passport` object on every request (passport 0.4 strategies are not used here).
      authenticator.initialize({ compat: false }),
      authenticator.session(),
      csrfProtection({ secure: config.secureCookies }),
    ]),
  );
  app.use(expressErrorHandler);

  app.setGlobalPrefix('api');
  app.useGlobalPipes(new ApiValidationPipe());
  app.useGlobalFilters(new AllExceptionsFilter());
  await app.init();
  // After Nest's routes (and its 404 for /api): anything else unknown gets the same shape.
  app.use((req: Request, _res: Response, next: NextFunction) => next(new ApiError('NOT_FOUND', `There is nothing at ${req.method} ${req.path}; check the address.`)));
  app.use(expressErrorHandler);
  app.get(AnswerReplay).install(app.getHttpServer());
  return app;
}
