// Every figure on a screen, in an e-mail or on a printout is formatted here: money from integer cents, numbers
// with their units, and calendar days. Amounts stay integer cents until this last step. Free of React, Next and
// zod, so customer pages can use it without growing their bundle.

const LOCALE = 'en-US';
/** What the shop charges in when a page has no shop settings at hand (shop_settings.currency defaults to it). */
export const DEFAULT_CURRENCY = 'usd';

/** "$1,234.50" from 123450 cents; "—" when there is no amount. `whole` drops the cents ("$1,235"). */
export function formatMoney(
  cents: number | null | undefined,
  options: { currency?: string | null; whole?: boolean } = {},
): string {
  if (cents === null || cents === undefined || !Number.isFinite(cents)) return '—';
  const currency = (options.currency || DEFAULT_CURRENCY).toUpperCase();
  return (cents / 100).toLocaleString(LOCALE, {
    style: 'currency',
    currency,
    ...(options.whole ? { maximumFractionDigits: 0 } : {}),
  });
}

/** "12.5", "12.50" or "$1,212.50" typed in a form → 121250 cents, exactly (no float arithmetic); null when it is not money. */
export function centsFromText(text: string): number | null {
  const m = /^\s*\$?(\d{1,9})(?:\.(\d{1,2}))?\s*$/.exec(text.replace(/,/g, ''));
  if (!m) return null;
  return Number(m[1]) * 100 + Number((m[2] ?? '').padEnd(2, '0'));
}

/** 123450 → "1234.50": cents as a money box shows them for editing (centsFromText reads them back). */
export const centsToText = (cents: number) => (cents / 100).toFixed(2);

/** "1,234.5 h"; inches and degrees sit against the figure ("0.550"", "110°"); "—" when there is no value. */
export function formatNumber(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toLocaleString(LOCALE, { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return unit ? `${text}${unit === '"' || unit === '°' ? '' : ' '}${unit}` : text;
}

export const deg = (v: number | null | undefined) => formatNumber(v, Number.isInteger(v ?? 0) ? 0 : 1, '°');
export const inches = (v: number | null | undefined) => formatNumber(v, 3, '"');
/** Basis points as a percent: 825 → "8.25 %". `digits` fixes the decimals (reports show two always). */
export const percentFromBp = (bp: number | null | undefined, digits?: number) =>
  bp === null || bp === undefined
    ? '—'
    : `${(bp / 100).toLocaleString(LOCALE, { minimumFractionDigits: digits ?? 0, maximumFractionDigits: digits ?? 2 })} %`;
/** Basis points for a percent box: 825 → "8.25", 2000 → "20". */
export const bpToPercentText = (bp: number) => String(bp / 100);
/** A typed percent ("8.25", "8.25 %", "20%") in basis points; null when it is not a percent with at most two decimals. */
export function bpFromPercentText(text: string): number | null {
  const match = /^\s*(\d{1,5})(?:\.(\d{1,2}))?\s*%?\s*$/.exec(text);
  if (!match) return null;
  return Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0'));
}
/** A signed change: "+4.2 %", "−1.0 %" (a real minus sign). */
export const pctText = (pct: number) => `${pct >= 0 ? '+' : '−'}${Math.abs(pct).toFixed(1)} %`;
export const count = (n: number, unit: string) => `${n.toLocaleString(LOCALE)} ${unit}`;
export const rpmText = (value: number | null | undefined) =>
  value === null || value === undefined ? '—' : `${Math.round(value).toLocaleString(LOCALE)} rpm`;
/** "2,300–2,700 rpm", or one figure when both ends agree. */
export const rpmRangeText = ([from, to]: readonly [number, number]) =>
  Math.round(from) === Math.round(to) ? rpmText(from) : `${Math.round(from).toLocaleString(LOCALE)}–${rpmText(to)}`;
export const hpText = (value: number) => `${value.toFixed(0)} hp`;
export const torqueText = (value: number) => `${value.toFixed(0)} lb·ft`;
export const degText = (value: number) => `${value.toFixed(1)}°`;

export function bytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(0)} kB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}

// Calendar days (YYYY-MM-DD, or the day part of an ISO time) are read at noon UTC, so no time zone moves them
// to the day before or after.
const calendarDay = (iso: string) => new Date(`${iso.slice(0, 10)}T12:00:00Z`);

/** "December 3, 2026": customer pages, e-mails and printouts. */
export const longDate = (iso: string) =>
  calendarDay(iso).toLocaleDateString(LOCALE, { year: 'numeric', month: 'long', day: 'numeric', timeZone: 'UTC' });
/** "Tue 3 Mar": the job board's days. */
export const dayLabel = (iso: string) =>
  calendarDay(iso).toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
/** "3 Dec 2026, 14:05": a moment on a staff screen, in the server's or browser's own zone. */
export const dateTime = (value: string | Date) =>
  new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(value));
