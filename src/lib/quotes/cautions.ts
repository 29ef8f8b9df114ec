// What a customer reads before paying for a cam swap, on the quote page and in its PDF alike. Each
// defers to local codes and licensed practice; none of it is legal or engineering advice for a vehicle.
export const CUSTOMER_CAUTIONS: readonly string[] = [
  'Emissions: many places do not allow an aftermarket cam on a road vehicle unless the part is certified for that vehicle. Ask us about the paperwork for your area.',
  'Brakes: a bigger cam can lower engine vacuum at idle, and vacuum brake boosters rely on it. We check brake assist before the vehicle leaves.',
  'Valvetrain: valve springs, piston-to-valve clearance and pushrod length are checked by a qualified technician on your engine, not assumed.',
  'Tune: the engine must be re-tuned after the swap. A higher-stall converter, if fitted, changes how the vehicle creeps and pulls away.',
  'Local codes and licensed practice come first: where they ask for more than this, we follow them.',
];

/** How refunds of the deposit work in the app (the shop's own policy text comes first). */
export const REFUND_NOTE =
  'A refund of the deposit goes back to the card it was paid with; depending on the bank it can take 5 to 10 working days to show. When the whole deposit is refunded the job is cancelled, or the quote opened again for a new payment, and we e-mail you either way.';
