// Account rules: sign-up creates an organization and its owner; preferences.
import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import { badRequest, conflict } from '../../errors/http-errors.js';
import { hashPassword } from './passwords.js';
import { isCommonPassword } from './common-passwords.js';
import { toAuthUser, type AuthUser } from './auth-user.js';
import { findActiveUser } from './passport.js';
import type { SignupBody, PreferencesBody } from '../../../../shared/schemas/auth.js';

export function assertAcceptablePassword(password: string, field = 'password') {
  if (isCommonPassword(password)) {
    throw badRequest('That password is too common; please choose another.', { [field]: 'is too common; choose another' });
  }
}

export function createAuthService(ctx: AppContext) {
  const { sequelize, models } = ctx;
  const { Organization, User } = models;
  return {
    async signup(body: SignupBody): Promise<AuthUser> {
      assertAcceptablePassword(body.password);
      const passwordHash = await hashPassword(body.password);
      try {
        const userId = await sequelize.transaction(async (transaction) => {
          const organization = await Organization.create(
            { kind: body.organization.kind, name: body.organization.name, timeZone: body.organization.timeZone, billingEmail: body.email, coloniesOwned: null },
            { transaction },
          );
          const user = await User.create(
            { organizationId: organization.id, email: body.email, name: body.name, passwordHash, role: 'owner', timeZone: null, calendarToken: null, disabledAt: null },
            { transaction },
          );
          return user.id;
        });
        return toAuthUser((await findActiveUser(models, { id: userId }))!);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw conflict('An account with that e-mail already exists.', { email: 'is already registered' });
        throw err;
      }
    },

    async updatePreferences(user: AuthUser, body: PreferencesBody): Promise<AuthUser> {
      await User.update(
        { ...(body.units ? { units: body.units } : {}), ...(body.timeZone !== undefined ? { timeZone: body.timeZone } : {}) },
        { where: { id: user.id } },
      );
      return toAuthUser((await findActiveUser(models, { id: user.id }))!);
    },
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
