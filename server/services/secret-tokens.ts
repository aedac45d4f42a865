import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';

/** A 256-bit random token for a link (invite, share); only its hash is stored. */
export function newLinkToken(): string {
  return randomBytes(32).toString('base64url');
}

export function sha256Hex(s: string): string {
  return createHash('sha256').update(s).digest('hex');
}

/**
 * A signed, non-expiring token `<payload>.<hmac>` (HMAC-SHA-256 with the server secret) for
 * links that must work without signing in, such as unsubscribing from reminders.
 */
export function signPayload(secret: string, purpose: string, payload: string): string {
  const mac = createHmac('sha256', secret).update(`${purpose}:${payload}`).digest('base64url');
  return `${Buffer.from(payload).toString('base64url')}.${mac}`;
}

/** The payload of a token made by `signPayload` with the same purpose, or null. */
export function verifySignedPayload(secret: string, purpose: string, token: string): string | null {
  const [encoded, mac] = token.split('.');
  if (!encoded || !mac) return null;
  const payload = Buffer.from(encoded, 'base64url').toString('utf8');
  const expected = createHmac('sha256', secret).update(`${purpose}:${payload}`).digest();
  const given = Buffer.from(mac, 'base64url');
  return given.length === expected.length && timingSafeEqual(given, expected) ? payload : null;
}
