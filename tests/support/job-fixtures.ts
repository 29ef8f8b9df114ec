import request from 'supertest';
import { makeSentQuote, type FixtureQuote } from './quote-fixtures';
import { readRuntime } from './runtime';

// A job the test owns: its own customer, build and quote, sent, and its deposit paid through the payments
// fake exactly as a customer would (checkout, pay page completed, signed webhook).
type Agent = ReturnType<typeof request.agent>;

export async function makePaidJob(counter: Agent, label: string): Promise<FixtureQuote & { token: string }> {
  const { appUrl, paymentsUrl } = readRuntime();
  const quote = await makeSentQuote(counter, label);
  const started = await request(appUrl).post(`/api/q/${quote.token}/checkout`).set('Accept', 'application/json');
  if (started.status !== 200) throw new Error(`checkout fixture answered ${started.status}: ${JSON.stringify(started.body)}`);
  const session = new URL(started.body.url).pathname.split('/').pop();
  const done = await request(paymentsUrl).post(`/_test/sessions/${session}/complete`);
  if (done.status !== 200) throw new Error(`payment fixture answered ${done.status}`);
  const deadline = Date.now() + 15_000;
  while ((await counter.get(`/api/quotes/${quote.id}`)).body.status !== 'deposit-paid') {
    if (Date.now() > deadline) throw new Error(`quote ${quote.number} was not marked paid`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return quote;
}

/** The shop's date, days from today, on this machine's clock (the server under test shares it). */
export function shopDay(days: number): string {
  const d = new Date();
  d.setDate(d.getDate() + days);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
