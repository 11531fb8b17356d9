import { createHash, randomBytes } from 'node:crypto';

/**
 * Link tokens for invitations and password resets, after the OWASP Forgot Password Cheat
 * Sheet: random from a CSPRNG, long enough not to guess (256 bits), stored only as a hash,
 * single-use and expiring (the services enforce the last two).
 */
export interface LinkToken {
  token: string;
  tokenHash: string;
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newLinkToken(): LinkToken {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}
