// Tokens sent in e-mailed links (invitations, password resets): 32 random bytes for the
// link, and only their SHA-256 hash for the database.
import { createHash, randomBytes } from 'node:crypto';

export function hashEmailedToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newEmailedToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashEmailedToken(token) };
}

/** The link the e-mail carries. The token sits in the fragment, which browsers never send, so it stays out of request logs. */
export function emailedLink(publicUrl: string, page: string, token: string): string {
  return `${publicUrl.replace(/\/$/, '')}/${page}#token=${token}`;
}
