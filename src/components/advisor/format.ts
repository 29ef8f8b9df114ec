// Display helpers for the staff advisor screens: numbers with their units, always.
export const rpmText = (rpm: number | null | undefined) => (rpm === null || rpm === undefined ? '—' : `${Math.round(rpm).toLocaleString('en-US')} rpm`);
/** "2,300–2,700 rpm", or one figure when both ends agree. */
export const rpmRangeText = ([from, to]: readonly [number, number]) => (Math.round(from) === Math.round(to) ? rpmText(from) : `${Math.round(from).toLocaleString('en-US')}–${rpmText(to)}`);
export const hpText = (hp: number) => `${hp.toFixed(0)} hp`;
export const torqueText = (lbFt: number) => `${lbFt.toFixed(0)} lb·ft`;
export const pctText = (pct: number) => `${pct >= 0 ? '+' : '−'}${Math.abs(pct).toFixed(1)} %`;
export const dollars = (cents: number) =>
  (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });
export const degText = (deg: number) => `${deg.toFixed(1)}°`;
