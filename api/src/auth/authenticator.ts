import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request } from 'express';
import type { SessionStore } from '../db/session-store';
import type { UsersRepository } from '../users/users.repository';
import { toMe } from '../users/users.mapper';
import type { AuthService } from './auth.service';

/** Injection token of this app's own passport instance. */
export const AUTHENTICATOR = Symbol('AUTHENTICATOR');
export type Authenticator = passport.Authenticator;

/**
 * A passport instance per app (not the module-wide singleton), so two apps in
 * one process (tests restart the api) never share strategies or serializers.
 * The local strategy checks e-mail and password; the session keeps the user id
 * only and reloads the person on each request, so a role or admin change
 * applies at once and a removed account is signed out.
 */
export function createAuthenticator(auth: AuthService, users: UsersRepository, sessions: SessionStore): Authenticator {
  const authenticator = new passport.Passport();
  authenticator.use(
    'local',
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.validateCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  authenticator.serializeUser((user, done) => done(null, user.id));
  // Three parameters: passport passes the request first. The session store has usually read the
  // person with the session (one query for both); otherwise, read them here.
  authenticator.deserializeUser((req: Request, id: unknown, done: (err: unknown, user?: Express.User | false) => void) => {
    if (typeof id !== 'number') return done(null, false);
    const read = sessions.takeUser(req.sessionID, id);
    if (read) return done(null, toMe(read));
    users.findActiveById(id).then((row) => done(null, row ? toMe(row) : false), done);
  });
  return authenticator;
}
