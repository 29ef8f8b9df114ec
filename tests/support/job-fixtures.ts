import request from 'supertest';
import { makeSentQuote, payDeposit, type FixtureQuote } from './quote-fixtures';

// A job the test owns: its own customer, build and quote, sent, and its deposit paid through the payments
// fake exactly as a customer would (checkout, pay page completed, signed webhook).
type Agent = ReturnType<typeof request.agent>;

export async function makePaidJob(counter: Agent, label: string): Promise<FixtureQuote & { token: string }> {
  const quote = await makeSentQuote(counter, label);
  await payDeposit(counter, quote);
  return quote;
}

/** The shop's date, days from today, on this machine's clock (the server under test shares it). */
export function shopDay(days: number): string {
  const d = new Date();
  d.setDate(d.getDate() + days);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
