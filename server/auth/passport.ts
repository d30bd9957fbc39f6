import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { DomainError } from '../errors/domain-error';
import { Operator, User } from '../models';
import { toSessionUser } from './session-user';
import { isKnownDevice } from './device-cookie';
import { checkSignIn, type SignInDeps } from './sign-in.service';

/**
 * passport with one local strategy (e-mail + password). The session holds only the user id;
 * each request reloads the person, so a role change or a lock takes effect at once.
 */
export function configurePassport(deps: Omit<SignInDeps, 'knownDevice'>): PassportStatic {
  const instance = new passport.Passport() as unknown as PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true, passReqToCallback: true }, (req, email, password, done) => {
      checkSignIn(email, password, { ...deps, knownDevice: (userId) => isKnownDevice(req, userId, deps.secret) }).then(
        (user) => done(null, toSessionUser(user)),
        (error: unknown) => (error instanceof DomainError ? done(null, false, error) : done(error)),
      );
    }),
  );
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((id: number, done) => {
    User.findByPk(id, { include: [{ model: Operator, as: 'operator' }] }).then(
      (user) => done(null, user && !user.lockedByAdmin ? toSessionUser(user) : false),
      (error: unknown) => done(error),
    );
  });
  return instance;
}
