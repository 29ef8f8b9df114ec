// Display formatting only; every amount stays in integer cents until it reaches the screen.
export function formatCents(cents: number | null | undefined): string {
  if (cents === null || cents === undefined) return '—';
  return (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
}

export function formatNumber(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return unit ? `${text}${unit === '"' || unit === '°' ? '' : ' '}${unit}` : text;
}

export const deg = (v: number | null | undefined) => formatNumber(v, Number.isInteger(v ?? 0) ? 0 : 1, '°');
export const inches = (v: number | null | undefined) => formatNumber(v, 3, '"');
export const percentFromBp = (bp: number) => `${(bp / 100).toLocaleString('en-US', { maximumFractionDigits: 2 })} %`;

export function bytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(0)} kB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}
