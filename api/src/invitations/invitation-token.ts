import { createHash, randomBytes } from 'node:crypto';

/** 32 random bytes, base64url: 43 characters, 256 bits (far beyond guessing). */
export function newInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

export function isWellFormedToken(token: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(token);
}

/**
 * What the database keeps instead of the token. A plain SHA-256 suffices:
 * the token is random and long, so there is nothing to brute-force (unlike a
 * password, which needs a slow KDF).
 */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
