// Which of the catalogue's spring kits goes on a quote: the kit whose rated max lift covers the cam's valve
// lift by the advisor's own rule (springsCoverLift in src/lib/advisor/needs.ts), the lowest-rated one that
// does (common practice, no published source: no more spring pressure than the lift needs, which is easier
// on the lobes and lifters), then the cheaper, then the lower id. Pure: the kits are loaded by the caller.
import { springsCoverLift } from '@/lib/advisor/needs';

export type SpringKit = {
  id: number;
  sku: string;
  name: string;
  priceCents: number;
  category?: string;
  /** The kit's rated max valve lift (in), from the part's spec `maxLiftIn`. */
  maxLiftIn: number;
};

/** A part's rated max lift when it is a spring kit that states one (spec `maxLiftIn`), else null. */
export function ratedMaxLiftIn(part: { category?: string; spec?: Record<string, unknown> | null }): number | null {
  const rated = part.spec?.maxLiftIn;
  return part.category === 'springs' && typeof rated === 'number' && Number.isFinite(rated) && rated > 0 ? rated : null;
}

/** The kit to fit for this valve lift, or null when no kit in the catalogue is rated for it. */
export function pickSpringKit(kits: readonly SpringKit[], liftIn: number): SpringKit | null {
  const covering = kits.filter((kit) => springsCoverLift(kit.maxLiftIn, liftIn));
  covering.sort((a, b) => a.maxLiftIn - b.maxLiftIn || a.priceCents - b.priceCents || a.id - b.id);
  return covering[0] ?? null;
}

/** The named warning a draft carries when no kit covers the lift: the rule's own kit stays, to be changed by hand. */
export const NO_SPRING_KIT_COVERS = 'no-spring-kit-covers-lift' as const;

export function noKitCoversMessage(liftIn: number, fallback: { sku: string } | null, bestIn: number | null): string {
  const lift = `${liftIn.toFixed(3)}"`;
  const best = bestIn === null ? 'no spring kit with a rated lift' : `none rated past ${bestIn.toFixed(3)}"`;
  return `No spring kit in the catalogue covers the cam's ${lift} valve lift (${best}). ${fallback ? `The rule's ${fallback.sku} is on the quote as a placeholder: ` : ''}choose springs rated for the lift and change the line by hand before sending.`;
}

/**
 * What a quote's lines say about springs, read back at any time: each rated kit on the quote that does not
 * cover the cam's lift, in words, with the kit that would (or that none in the catalogue does).
 */
export function springKitShortfalls(
  lines: readonly { partId: number | null }[],
  kits: readonly SpringKit[],
  liftIn: number,
): string[] {
  const onQuote = kits.filter((kit) => lines.some((line) => line.partId === kit.id));
  const better = pickSpringKit(kits, liftIn);
  return onQuote
    .filter((kit) => !springsCoverLift(kit.maxLiftIn, liftIn))
    .map(
      (kit) =>
        `${kit.sku} is rated to ${kit.maxLiftIn.toFixed(3)}", below the cam's ${liftIn.toFixed(3)}" valve lift: ${
          better
            ? `${better.sku} (rated to ${better.maxLiftIn.toFixed(3)}") covers it.`
            : 'no spring kit in the catalogue covers it; choose springs rated for the lift and change the line by hand.'
        }`,
    );
}
