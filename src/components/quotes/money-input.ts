/** "12.5" or "12.50" dollars → 1250 cents, exactly (no float arithmetic); null when it is not money. */
export function dollarsToCents(text: string): number | null {
  const m = /^\s*(\d{1,7})(?:\.(\d{1,2}))?\s*$/.exec(text);
  if (!m) return null;
  return Number(m[1]) * 100 + Number((m[2] ?? '').padEnd(2, '0'));
}
