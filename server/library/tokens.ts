import { createHash, randomBytes } from 'node:crypto';

/** A secret for a link: 256 random bits, of which only a hash is stored, so a stolen database opens nothing. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
