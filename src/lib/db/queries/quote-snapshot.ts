import 'server-only';
import { rankForShop } from '@/lib/advisor-service';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import type { QuoteSnapshot } from '@/lib/quotes/types';
import { Build } from '../models';

// What a sent quote was based on, frozen at its first send: the build profile as it stood and the
// advisor's result for the quoted cam (without the curve points). A later edit of the build, the
// catalogue or the advisor changes neither what the customer was shown nor what staff read back.

export type { QuoteSnapshot };

/** Worked out before the send transaction (ranking takes a while; no row is locked meanwhile). */
export async function takeSnapshot(buildId: number | null, camId: number | null): Promise<QuoteSnapshot | null> {
  if (buildId === null) return null;
  const build = await Build.findByPk(buildId, { attributes: ['id', 'profile'] });
  if (!build) return null;
  const profile = typeof build.profile === 'string' ? (JSON.parse(build.profile) as unknown) : build.profile;
  let advice: Record<string, unknown> | null = null;
  const parsed = BuildProfileSchema.safeParse(profile);
  if (parsed.success && camId !== null) {
    // The advice is what the customer is shown beside the price; without it the profile is still frozen.
    const ranked = await rankForShop(parsed.data, { camIds: [camId], includeCurves: false }).catch((error: unknown) => {
      console.error(`[quotes] the advisor could not rank cam ${camId} for build ${buildId}; sending without its advice`, error);
      return null;
    });
    const ranking = ranked?.ok ? ranked.result.rankings.find((r) => String(r.camId) === String(camId)) : undefined;
    if (ranking) {
      const { curve: _curve, ...rest } = ranking as typeof ranking & { curve?: unknown };
      void _curve;
      advice = JSON.parse(JSON.stringify(rest)) as Record<string, unknown>;
    }
  }
  return { profile, advice };
}

/** MariaDB hands JSON columns back as text through this driver; read either form. */
export function readJson(value: unknown): unknown {
  if (typeof value !== 'string') return value ?? null;
  try {
    return JSON.parse(value) as unknown;
  } catch {
    return null;
  }
}
