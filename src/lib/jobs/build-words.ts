// The build sheet in words: the stored codes ("aluminum", "full-with-cats") are for the database and the
// advisor; the bench reads sentences.
const HEADS: Record<string, string> = { iron: 'Iron heads', aluminum: 'Aluminium heads' };
const INTAKES: Record<string, string> = {
  truck: 'Truck intake (long runners)',
  car: 'Car intake (lower, shorter runners)',
  'single-plane': 'Single-plane intake (race style)',
};
const DEACTIVATION: Record<string, string> = {
  none: 'None fitted',
  active: 'Fitted and working',
  deleted: 'Deleted (disabled)',
};
const HEADERS: Record<string, string> = {
  manifold: 'Cast manifolds (stock)',
  shorty: 'Shorty headers',
  'long-tube': 'Long-tube headers',
};
const EXHAUST: Record<string, string> = {
  full: 'Full exhaust, no catalytic converters',
  'full-with-cats': 'Full exhaust with catalytic converters',
  'open-short': 'Short or open collectors',
};
const TRANSMISSIONS: Record<string, string> = { automatic: 'Automatic', manual: 'Manual' };
const BRAKES: Record<string, string> = {
  vacuum: 'Vacuum brake booster',
  hydraulic: 'Hydraulic brake assist',
  none: 'No power brakes',
};
const USES: Record<string, string> = {
  daily: 'Daily driver',
  towing: 'Towing and hauling',
  street: 'Street performance',
  strip: 'Drag strip',
};

// An unknown code still shows (as itself) rather than vanishing, so a new choice is never hidden.
const say = (table: Record<string, string>) => (code: string) => table[code] ?? code;

export const words = {
  heads: say(HEADS),
  intake: say(INTAKES),
  deactivation: say(DEACTIVATION),
  headers: say(HEADERS),
  exhaust: say(EXHAUST),
  transmission: say(TRANSMISSIONS),
  brakes: say(BRAKES),
  use: say(USES),
};
