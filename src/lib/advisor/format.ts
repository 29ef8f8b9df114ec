// Number formatting for sentences read aloud. Hand-rolled so the output never depends on the
// server's locale settings (the advisor must be deterministic).

/** 3100 → "3,100". */
export function groupThousands(n: number): string {
  const sign = n < 0 ? '-' : '';
  let digits = String(Math.round(Math.abs(n)));
  let out = '';
  while (digits.length > 3) {
    out = `,${digits.slice(-3)}${out}`;
    digits = digits.slice(0, -3);
  }
  return sign + digits + out;
}

/** An rpm said "about": rounded to the nearest 100. */
export function aboutRpm(rpm: number): string {
  return groupThousands(Math.round(rpm / 100) * 100);
}

/** A percentage with no decimals, signed when asked: "+4 %", "−6 %" read as "4%". */
export function pct(value: number, signed = false): string {
  const r = Math.round(value);
  const s = signed && r > 0 ? '+' : '';
  return `${s}${r}%`;
}

/** Whole dollars from cents: 43900 → "$439". */
export function dollars(cents: number): string {
  return `$${groupThousands(cents / 100)}`;
}

/** Dollars and cents from cents, as a quote shows them: 301250 → "$3,012.50". */
export function dollarsAndCents(cents: number): string {
  const whole = Math.round(cents);
  return `${whole < 0 ? '-' : ''}$${groupThousands(Math.floor(Math.abs(whole) / 100))}.${String(Math.abs(whole) % 100).padStart(2, '0')}`;
}

/** Valve lift in inches with three decimals: 0.595 → '0.595"'. */
export function inches(value: number): string {
  return `${value.toFixed(3)}"`;
}

/** One decimal: 8.24 → "8.2". */
export function oneDecimal(value: number): string {
  return (Math.round(value * 10) / 10).toFixed(1);
}

/** Round for output, to a number of decimals. */
export function roundTo(value: number, decimals: number): number {
  const f = Math.pow(10, decimals);
  return Math.round(value * f) / f;
}
