import crypto from 'node:crypto';
import type { RateLimiterMySQL } from 'rate-limiter-flexible';
import { contactKeys } from '@/lib/leads/contact-key';
import { LEAD_LIMITS } from '@/lib/schemas/lead';
import { consumePoint, makeLimiter, retryAfterSeconds } from './store';

// Flood guards on the public lead form: per contact (normalised e-mail and phone, src/lib/leads/contact-key.ts)
// and per address (generous: a café or a phone carrier puts many customers behind one address). Each
// post reserves its points before any work, in one atomic upsert per key, so concurrent posts cannot all pass.
type Limiters = { contact: RateLimiterMySQL; address: RateLimiterMySQL };
let limiters: Limiters | undefined;

function leadLimiters(): Limiters {
  limiters ??= {
    contact: makeLimiter({
      keyPrefix: 'lead-contact',
      points: LEAD_LIMITS.perContactPerHour,
      durationSeconds: 60 * 60,
    }),
    address: makeLimiter({
      keyPrefix: 'lead-address',
      points: LEAD_LIMITS.perAddressPerHour,
      durationSeconds: 60 * 60,
    }),
  };
  return limiters;
}

const hashed = (key: string) => crypto.createHash('sha256').update(key).digest('hex');

export type LeadReservation =
  { ok: true; release: () => Promise<void> } | { ok: false; retryAfterSeconds: number; reason: 'contact' | 'address' };

/** Takes one point per contact key and one for the address; any refusal gives the others back. */
export async function reserveLeadPost(
  contact: { email?: string; phone?: string },
  ip: string,
): Promise<LeadReservation> {
  const { contact: byContact, address } = leadLimiters();
  const taken: { limiter: RateLimiterMySQL; key: string }[] = [];
  const release = async () => {
    await Promise.all(taken.map(({ limiter, key }) => limiter.reward(key, 1)));
  };
  const wanted = [
    { limiter: address, key: ip, reason: 'address' as const },
    ...contactKeys(contact).map((key) => ({ limiter: byContact, key: hashed(key), reason: 'contact' as const })),
  ];
  for (const { limiter, key, reason } of wanted) {
    const result = await consumePoint(limiter, key);
    if (!result.allowed) {
      await Promise.all([release(), limiter.reward(key, 1)]);
      return { ok: false, retryAfterSeconds: retryAfterSeconds(result.res), reason };
    }
    taken.push({ limiter, key });
  }
  return { ok: true, release };
}
