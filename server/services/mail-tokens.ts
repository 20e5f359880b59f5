import { createHash, randomBytes } from 'node:crypto';

/**
 * Single-use tokens for links in mail. The link carries 32 random bytes (base64url, 43 characters); the
 * database keeps only their SHA-256, so a copy of the database opens no account and no crew. A plain
 * hash is enough (no bcrypt): the token is random and long, not a password a person chose.
 */
export function mailTokenNew(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: mailTokenHash(token) };
}

export function mailTokenHash(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
