// Password hashing with scrypt (memory-hard, built into Node). Stored as
// scrypt$N$r$p$salt$hash, so the cost can be raised later without breaking old hashes.
import { scrypt, randomBytes, timingSafeEqual, type ScryptOptions } from 'node:crypto';

export interface ScryptCost { N: number; r: number; p: number }

/** The cost of every hash the server makes. Verifying uses the cost stored in the hash. */
export const passwordCost: ScryptCost = { N: 2 ** 15, r: 8, p: 1 };
const keyLength = 32;

function derive(password: string, salt: Buffer, options: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(password.normalize('NFKC'), salt, keyLength, { ...options, maxmem: 128 * 1024 * 1024 }, (err, key) =>
      err ? reject(err) : resolve(key),
    ),
  );
}

export async function hashPassword(password: string, cost: ScryptCost = passwordCost): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive(password, salt, cost);
  return ['scrypt', cost.N, cost.r, cost.p, salt.toString('base64'), key.toString('base64')].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, N, r, p, salt, hash] = stored.split('$');
  if (scheme !== 'scrypt' || !salt || !hash) return false;
  const expected = Buffer.from(hash, 'base64');
  const actual = await derive(password, Buffer.from(salt, 'base64'), { N: Number(N), r: Number(r), p: Number(p) });
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

/** A hash of a random password, verified against when the e-mail is unknown so both paths take the same time. */
export const decoyHash = hashPassword(randomBytes(18).toString('base64'));
