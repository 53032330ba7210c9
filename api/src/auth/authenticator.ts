import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
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
export function createAuthenticator(auth: AuthService, users: UsersRepository): Authenticator {
  const authenticator = new passport.Passport();
  authenticator.use(
    'local',
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.validateCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  authenticator.serializeUser((user, done) => done(null, user.id));
  authenticator.deserializeUser((id: unknown, done) => {
    if (typeof id !== 'number') return done(null, false);
    users.findActiveById(id).then((row) => done(null, row ? toMe(row) : false), done);
  });
  return authenticator;
}
