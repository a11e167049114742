// Password reset by e-mail: a single-use token valid for one hour. Asking never reveals
// whether an account exists; using a token sets the password, spends every outstanding
// token of that user and ends their sessions.
import { Op } from 'sequelize';
import type { AppContext } from '../../context.js';
import { badRequest } from '../../errors/http-errors.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { hashPassword } from './passwords.js';
import { assertAcceptablePassword } from './auth.service.js';
import { emailedLink, hashEmailedToken, newEmailedToken } from './emailed-tokens.js';
import { endSessionsOf } from './end-sessions.js';
import type { PasswordResetConfirmBody, PasswordResetRequestBody } from '../../../../shared/schemas/auth.js';

export const resetTokenLifetimeMs = 60 * 60_000;

const invalidToken = () => badRequest('This reset link is not valid any more. Please ask for a new one.', { token: 'is invalid, used or expired; ask for a new link' });

export function createPasswordResetService(ctx: AppContext) {
  const { PasswordResetToken, User } = ctx.models;
  return {
    async request({ email }: PasswordResetRequestBody): Promise<void> {
      const user = await User.findOne({ where: { email, disabledAt: null } });
      if (!user) return;
      const { token, tokenHash } = newEmailedToken();
      await PasswordResetToken.create({ userId: user.id, tokenHash, expiresAt: new Date(ctx.now().getTime() + resetTokenLifetimeMs), usedAt: null });
      const link = emailedLink(ctx.config.publicUrl, 'reset-password', token);
      await enqueueEmail(ctx.jobs, {
        to: user.email,
        subject: 'Reset your Pollenpact password',
        text: [
          `Hello ${user.name},`,
          '',
          'Someone (hopefully you) asked to reset the password of your Pollenpact account.',
          `Choose a new password here: ${link}`,
          '',
          'The link works once and expires in one hour. If you did not ask, ignore this e-mail: your password stays as it is.',
        ].join('\n'),
      });
    },

    async confirm({ token, password }: PasswordResetConfirmBody): Promise<void> {
      assertAcceptablePassword(password);
      const passwordHash = await hashPassword(password);
      const userId = await ctx.sequelize.transaction(async (transaction) => {
        const row = await PasswordResetToken.findOne({ where: { tokenHash: hashEmailedToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
        if (!row || row.usedAt || row.expiresAt.getTime() <= ctx.now().getTime()) throw invalidToken();
        const [updated] = await User.update({ passwordHash }, { where: { id: row.userId, disabledAt: null }, transaction });
        if (updated !== 1) throw invalidToken();
        await PasswordResetToken.update({ usedAt: ctx.now() }, { where: { userId: row.userId, usedAt: { [Op.is]: null } }, transaction });
        return row.userId;
      });
      await endSessionsOf(ctx, userId);
    },
  };
}

export type PasswordResetService = ReturnType<typeof createPasswordResetService>;
