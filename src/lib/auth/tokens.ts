import crypto from 'node:crypto';

/** 32 random bytes, URL-safe: for session ids and e-mailed password links. */
export function randomToken(): string {
  return crypto.randomBytes(32).toString('base64url');
}

/** What the database keeps instead of a token: its SHA-256, hex. */
export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
