import { createHash, randomBytes } from 'node:crypto';

/** A random token for a link or an API token: 32 bytes, base64url. */
export function newSecret(bytes = 32): string {
  return randomBytes(bytes).toString('base64url');
}

/** Stored form of a token: sha256, hex. The token itself is never stored. */
export function sha256Hex(value: string): string {
  return createHash('sha256').update(value, 'utf8').digest('hex');
}
