// Session settings, read from the environment. Server-only.

export const SESSION_COOKIE = 'lobewise_session';
/** A staff session lasts one long shift; after that the person signs in again. */
export const SESSION_TTL_SECONDS = 12 * 60 * 60;
export const MIN_SECRET_LENGTH = 32;

/** SESSION_SECRET, or a clear error saying what is wrong with it. */
export function sessionSecret(): string {
  const secret = process.env.SESSION_SECRET;
  if (!secret) {
    throw new Error(
      'SESSION_SECRET is not set. It signs and encrypts the staff session cookie; set it to a random string of 32 or more characters (see .env.example).',
    );
  }
  if (secret.length < MIN_SECRET_LENGTH) {
    throw new Error(
      `SESSION_SECRET is ${secret.length} characters long; it must be at least ${MIN_SECRET_LENGTH}. Use a long random string (see .env.example).`,
    );
  }
  return secret;
}
