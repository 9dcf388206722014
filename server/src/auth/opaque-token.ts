import { createHash, randomBytes } from 'node:crypto';

/** SHA-256 of a token, hex: what the database keeps instead of the token itself. */
export function hashOpaqueToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A fresh single-use token (32 random bytes, base64url) and the hash to store. */
export function newOpaqueToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashOpaqueToken(token) };
}
