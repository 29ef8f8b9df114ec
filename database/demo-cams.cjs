'use strict';

// The demo shop's cam catalogue: invented grinds from invented suppliers. Factory-style baseline cards
// are approximate figures from memory, for demonstration only. Read by the demo seeder and by
// `npm run bench:advisor` (the "demo catalogue" figure).
// [sku, name, supplier, in050, ex050, inAdv, exAdv, inLift, exLift, lsa, icl, price $, stock, certified, deactOk, springMaxLift, notes]
const camRows = [
  ['FB-48', 'Factory-style 4.8 L baseline card', null, 190, 191, null, null, 0.467, 0.479, 114.5, 114.5, 0, 0, true, true, 0.5, 'Reference card for a stock 4.8 L truck engine (approximate, from memory).'],
  ['FB-53', 'Factory-style 5.3 L baseline card', null, 190, 191, null, null, 0.467, 0.479, 114.5, 114.5, 0, 0, true, true, 0.5, 'Reference card for a stock 5.3 L truck engine (approximate, from memory).'],
  ['FB-57', 'Factory-style 5.7 L baseline card', null, 198, 208, null, null, 0.5, 0.5, 115.5, 113, 0, 0, true, false, 0.55, 'Reference card for a stock 5.7 L car engine (approximate, from memory).'],
  ['FB-60', 'Factory-style 6.0 L baseline card', null, 190, 191, null, null, 0.467, 0.479, 114.5, 114.5, 0, 0, true, true, 0.5, 'Reference card for a stock 6.0 L truck engine (approximate, from memory).'],
  ['FB-62', 'Factory-style 6.2 L baseline card', null, 200, 207, null, null, 0.551, 0.522, 116.5, 118, 0, 0, true, true, 0.57, 'Reference card for a stock 6.2 L engine (approximate, from memory).'],
  ['F9-194', 'Foundry Nine Easy Daily 194', 3, 194, 200, 246, 252, 0.5, 0.51, 116, 112, 329, 6, true, true, null, 'Mild, certified for road use where its paperwork covers the vehicle.'],
  ['RB-198', 'Ridgeback Tow Boss 198', 1, 198, 204, 250, 256, 0.525, 0.525, 114, 110, 369, 4, true, true, null, 'Towing grind; keeps vacuum for brake assist.'],
  ['RB-204', 'Ridgeback Low Rise 204', 1, 204, 210, 256, 262, 0.54, 0.54, 113, 111, 389, 3, false, true, null, null],
  ['LV-208', 'Lantern Valley Hauler 208', 2, 208, 214, 260, 266, 0.55, 0.55, 114, 110, 399, 5, false, false, null, null],
  ['RB-210', 'Ridgeback Tow Plus 210', 1, 210, 216, 262, 268, 0.555, 0.555, 116, 112, 399, 2, false, false, null, 'Wide separation for a calm idle.'],
  ['LV-212', 'Lantern Valley Truck Torque 212', 2, 212, 218, 264, 270, 0.565, 0.565, 113, 109, 419, 6, false, false, null, 'The counter favourite for trucks on a stock converter.'],
  ['F9-216', 'Foundry Nine Street Pull 216', 3, 216, 222, 268, 274, 0.58, 0.58, 112, 108, 429, 3, false, false, null, null],
  ['F9-219', 'Foundry Nine Big Truck 219', 3, 219, 225, 271, 277, 0.595, 0.595, 113, 109, 439, 4, false, false, null, 'Wants a converter near 3,000 rpm.'],
  ['RB-220', 'Ridgeback Grumbler 220', 1, 220, 228, 272, 280, 0.6, 0.59, 112, 108, 439, 2, false, false, null, null],
  ['LV-224', 'Lantern Valley Strip Street 224', 2, 224, 232, 276, 284, 0.612, 0.605, 111, 107, 459, 2, false, false, null, null],
  ['LV-226', 'Lantern Valley Wide Street 226', 2, 226, 232, 278, 284, 0.61, 0.61, 114, 110, 459, 1, false, false, null, null],
  ['F9-228', 'Foundry Nine Rowdy 228', 3, 228, 236, 280, 288, 0.624, 0.615, 110, 106, 479, 1, false, false, null, null],
  ['RB-231', 'Ridgeback Bracket 231', 1, 231, 239, 283, 291, 0.63, 0.624, 110, 105, 489, 1, false, false, null, 'Strip use; needs piston-to-valve checked on every build.'],
  ['LV-235', 'Lantern Valley Full Send 235', 2, 235, 243, 287, 295, 0.64, 0.63, 108, 104, 499, 0, false, false, null, 'Race only.'],
];

/** The stocked (non-baseline) grinds as advisor cam cards. */
function demoCamCards() {
  return camRows.filter((r) => !r[0].startsWith('FB-')).map((r) => ({
    id: r[0], name: r[1], intakeDuration050: r[3], exhaustDuration050: r[4], intakeAdvertised: r[5] ?? undefined, exhaustAdvertised: r[6] ?? undefined,
    intakeLiftIn: r[7], exhaustLiftIn: r[8], lsa: r[9], intakeCenterline: r[10], priceCents: r[11] * 100, emissionsCertified: r[13],
    deactivationCompatible: r[14], springMaxLiftIn: r[15] ?? undefined,
  }));
}

module.exports = { camRows, demoCamCards };
