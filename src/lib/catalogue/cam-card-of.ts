import type { CamCard } from '@/lib/schemas/cam-card';

// A stored cam (model row, API record or baseline option) as the advisor's cam card. Pure, so the
// questionnaire's profile builder and the ranking query share it; "not given" (null) becomes undefined.
export type CamCardSource = {
  id: number;
  sku: string;
  name: string;
  intakeDuration050: number;
  exhaustDuration050: number;
  intakeAdvertised: number | null;
  exhaustAdvertised: number | null;
  intakeLiftIn: number;
  exhaustLiftIn: number;
  lsa: number;
  intakeCenterline: number;
  rockerRatio: number;
  springMaxLiftIn: number | null;
  deactivationCompatible?: boolean;
  emissionsCertified?: boolean;
  priceCents?: number;
};

export function camCardOf(cam: CamCardSource): CamCard {
  return {
    id: cam.id,
    name: `${cam.sku} ${cam.name}`,
    intakeDuration050: cam.intakeDuration050,
    exhaustDuration050: cam.exhaustDuration050,
    intakeAdvertised: cam.intakeAdvertised ?? undefined,
    exhaustAdvertised: cam.exhaustAdvertised ?? undefined,
    intakeLiftIn: cam.intakeLiftIn,
    exhaustLiftIn: cam.exhaustLiftIn,
    lsa: cam.lsa,
    intakeCenterline: cam.intakeCenterline,
    rockerRatio: cam.rockerRatio,
    springMaxLiftIn: cam.springMaxLiftIn ?? undefined,
    ...(cam.deactivationCompatible === undefined ? {} : { deactivationCompatible: cam.deactivationCompatible }),
    ...(cam.emissionsCertified === undefined ? {} : { emissionsCertified: cam.emissionsCertified }),
    ...(cam.priceCents === undefined ? {} : { priceCents: cam.priceCents }),
  };
}

/**
 * The grind's own name from a catalogue cam's card name (`${sku} ${name}` above; a SKU has no spaces): what
 * the customer view shows, without the shop's shelf code.
 */
export function grindNameOf(cardName: string): string {
  const space = cardName.indexOf(' ');
  return space > 0 ? cardName.slice(space + 1) : cardName;
}
