// Sign-in attempts (and password reset requests) are limited per address and per account
// (e-mail), so guessing is slow from one machine and against one account from many.
import { rateLimit } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Config } from '../../config/env.js';
import type { ErrorBody } from '../../../../shared/errors.js';

const tooMany = (what: string): ErrorBody => ({ error: { code: 'rate_limited', message: `Too many ${what}. Please wait a few minutes and try again.` } });

function perAddressAndAccount(config: Config, what: string): RequestHandler[] {
  const windowMs = 15 * 60_000;
  const common = { windowMs, standardHeaders: 'draft-8' as const, legacyHeaders: false, message: tooMany(what) };
  return [
    rateLimit({ ...common, limit: config.loginRateLimit.perAddress, identifier: 'address' }),
    rateLimit({
      ...common,
      limit: config.loginRateLimit.perAccount,
      identifier: 'account',
      keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    }),
  ];
}

export function createLoginRateLimits(config: Config): RequestHandler[] {
  return perAddressAndAccount(config, 'sign-in attempts');
}

export function createPasswordResetRateLimits(config: Config): RequestHandler[] {
  return perAddressAndAccount(config, 'password reset requests');
}
