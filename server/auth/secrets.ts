import { createHash, randomBytes } from 'node:crypto';

/** An unguessable one-time token (256 bits, URL-safe). Only its hash is stored. */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** SHA-256 (hex): tokens are high-entropy, so an unsalted fast hash is enough to make a stolen table useless. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
