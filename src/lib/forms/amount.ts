import { centsFromText, formatMoney } from '@/lib/format';

/**
 * An amount typed at the counter (a balance taken, a deposit refunded) read into cents and held to what is
 * left: `{ cents }`, or the problem in words. The route checks the same limits again.
 */
export function amountWithin(
  text: string,
  leftCents: number,
  leftTo: 'pay' | 'refund',
): { cents: number } | { problem: string } {
  const cents = centsFromText(text);
  if (cents === null || cents <= 0) return { problem: 'The amount must be dollars and cents above 0.' };
  if (cents > leftCents) return { problem: `At most ${formatMoney(leftCents)} is left to ${leftTo}.` };
  return { cents };
}
