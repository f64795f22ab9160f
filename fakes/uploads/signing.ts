import { createHmac, timingSafeEqual } from 'node:crypto';

// The SDK's scheme: "hmac-sha256=" + hex(HMAC-SHA256(apiKey, payload)), for hook bodies and URLs alike.
const PREFIX = 'hmac-sha256=';

export function sign(payload: string, apiKey: string): string {
  return PREFIX + createHmac('sha256', apiKey).update(payload, 'utf8').digest('hex');
}

export function verifySignature(payload: string, signature: string | null | undefined, apiKey: string): boolean {
  if (!signature || !signature.startsWith(PREFIX)) return false;
  const expected = Buffer.from(sign(payload, apiKey));
  const given = Buffer.from(signature);
  return given.length === expected.length && timingSafeEqual(given, expected);
}
