import { currentBuildProfile } from '@/lib/db/queries/quote-snapshot';
import { rankForShop } from '@/lib/ranking/rank-for-shop';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import type { QuoteSnapshot } from './types';

// What a sent quote was based on, frozen at its first send: the build profile as it stood and the
// advisor's result for the quoted cam (without the curve points). A later edit of the build, the
// catalogue or the advisor changes neither what the customer was shown nor what staff read back.

/** Worked out before the send transaction (ranking takes a while; no row is locked meanwhile). */
export async function takeSnapshot(buildId: number | null, camId: number | null): Promise<QuoteSnapshot | null> {
  if (buildId === null) return null;
  const stored = await currentBuildProfile(buildId);
  if (!stored) return null;
  const { profile } = stored;
  let advice: Record<string, unknown> | null = null;
  const parsed = BuildProfileSchema.safeParse(profile);
  if (parsed.success && camId !== null) {
    // The advice is what the customer is shown beside the price; without it the profile is still frozen.
    const ranked = await rankForShop(parsed.data, { camIds: [camId], includeCurves: false }).catch((error: unknown) => {
      console.error(
        `[quotes] the advisor could not rank cam ${camId} for build ${buildId}; sending without its advice`,
        error,
      );
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
