// One passport instance per app: the local strategy (e-mail + password) and loading the
// session's user from the database on every request.
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Models } from '../../db/models/index.js';
import { toAuthUser, type AuthUserSource } from './auth-user.js';
import { verifyPassword, decoyHash } from './passwords.js';
import { selectSessionUser } from './auth.queries.js';

export async function findActiveUser(models: Models, where: { id?: string; email?: string }) {
  const user = await models.User.findOne({ where, include: [{ model: models.Organization, as: 'organization' }] });
  return user && !user.disabledAt ? user : null;
}

export type AppPassport = ReturnType<typeof createPassport>;

export function createPassport(models: Models) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await findActiveUser(models, { email: email.trim().toLowerCase() });
        const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash));
        done(null, user && user.passwordHash && ok ? toAuthUser(user) : false);
      } catch (err) {
        done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser(async (id: string, done) => {
    try {
      const user = await selectSessionUser(models.User.sequelize!, id);
      done(null, user ? toAuthUser(user) : false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
