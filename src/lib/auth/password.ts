import argon2 from 'argon2';

// Password hashing: argon2id with the OWASP Password Storage Cheat Sheet's first recommended
// setting (m = 19 MiB, t = 2, p = 1). When these change, hashes made with the old ones are
// replaced the next time their owner signs in (see needsNewHash).
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

/** False for a wrong password and for a malformed stored hash; never throws on bad input. */
export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

export function needsNewHash(hash: string): boolean {
  try {
    return (
      argon2.needsRehash(hash, {
        memoryCost: ARGON2_OPTIONS.memoryCost,
        timeCost: ARGON2_OPTIONS.timeCost,
        parallelism: ARGON2_OPTIONS.parallelism,
      }) || !hash.startsWith('$argon2id$')
    );
  } catch {
    return true;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Spends the same effort as a real check when there is no account or no password yet, so the
 * answer time does not tell which e-mail addresses exist.
 */
export async function burnVerifyTime(password: string): Promise<void> {
  dummyHash ??= hashPassword('lobewise-timing-equaliser');
  await verifyPassword(await dummyHash, password);
}
