import { CamCatalogueSchema, type CamCard } from '../lib/schemas/cam-card';

// Deterministic pseudo-random numbers (mulberry32), so every run ranks the same catalogue.
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** n invented grinds spread over what shops stock (190–250° at 0.050", 106–118° LSA); the same n gives the same list. */
export function generatedCatalogue(n: number, seed = 20261202): CamCard[] {
  const rnd = mulberry32(seed);
  const cams = [];
  for (let i = 0; i < n; i++) {
    const dur = 190 + Math.round(rnd() * 60);
    const lsa = 106 + Math.round(rnd() * 12);
    const lift = Math.round((0.45 + (dur - 190) * 0.005 + rnd() * 0.03) * 1000) / 1000;
    cams.push({
      id: `GEN-${String(i).padStart(4, '0')}`,
      name: `Generated grind ${dur}`,
      intakeDuration050: dur,
      exhaustDuration050: dur + Math.round(rnd() * 10),
      intakeLiftIn: lift,
      exhaustLiftIn: lift,
      lsa,
      intakeCenterline: lsa - Math.round(rnd() * 6),
      emissionsCertified: rnd() < 0.1,
      deactivationCompatible: rnd() < 0.3,
      priceCents: 30000 + Math.round(rnd() * 25000),
    });
  }
  return CamCatalogueSchema.parse(cams);
}
