import crypto from 'node:crypto';

/** A single-use link token: 32 random bytes for the e-mail, only its SHA-256 kept in the database. */
export function createLinkToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkToken(token) };
}

export const hashLinkToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');
