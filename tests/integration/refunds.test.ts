import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makeSentQuote, type FixtureQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';

// Refunds that tell the truth (issue 12, item 4): after a full refund no page says "Deposit paid" or
// "Your job is booked", the customer is e-mailed, and the manager chooses between cancelling the job and
// reopening the quote. Each test pays its own fixture quote through the payments fake.
const { appUrl, mailUrl, paymentsUrl } = readRuntime();

let counter: Awaited<ReturnType<typeof signedInAgent>>;
let manager: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  connectTestDatabase();
  [counter, manager] = await Promise.all([signedInAgent('counter'), signedInAgent('manager')]);
});
afterAll(() => disconnectTestDatabase());

async function paidQuote(label: string): Promise<FixtureQuote & { token: string }> {
  const quote = await makeSentQuote(counter, label);
  const started = await request(appUrl)
    .post(`/api/q/${quote.token}/checkout`)
    .set('Accept', 'application/json')
    .expect(200);
  await request(paymentsUrl)
    .post(`/_test/sessions/${new URL(started.body.url).pathname.split('/').pop()}/complete`)
    .expect(200);
  const deadline = Date.now() + 15_000;
  while ((await manager.get(`/api/quotes/${quote.id}`)).body.status !== 'deposit-paid') {
    if (Date.now() > deadline) throw new Error(`quote ${quote.number} was not marked paid`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return quote;
}

const refundMails = async (to: string) =>
  ((await request(mailUrl).get('/messages').query({ to })).body as { subject: string; text: string }[]).filter((m) =>
    /refunded/.test(m.subject),
  );

describe('a full refund', () => {
  it('cancels the job by default: staff pages, jobs list and the customer page stop saying it is paid, and the customer is e-mailed', async () => {
    const quote = await paidQuote('Full refund');
    const before = await request(appUrl).get(`/q/${quote.token}`);
    expect(before.text).toContain('Your job is booked');
    expect((await manager.get('/jobs')).text).toContain(quote.number);

    const res = await manager
      .post(`/api/quotes/${quote.id}/refund`)
      .send({ amountCents: quote.depositCents, reason: 'customer changed plans' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'cancelled', refundedCents: quote.depositCents });

    const staffPage = await manager.get(`/quotes/${quote.id}`);
    expect(staffPage.text).not.toContain('Deposit paid');
    expect(staffPage.text).toContain('Cancelled');
    expect((await manager.get('/quotes')).text).toContain(quote.number);
    expect((await manager.get('/jobs')).text).not.toContain(quote.number);
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).not.toContain('Deposit paid');
    expect(page.text).not.toContain('Your job is booked');
    expect(page.text).toContain('Deposit refunded');
    expect(page.text).not.toContain('Accept and pay the deposit');

    const mails = await refundMails(quote.customerEmail);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toContain(quote.number);
    expect(mails[0].text).toContain(
      (quote.depositCents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' }),
    );
    expect(mails[0].text).toMatch(/cancelled/);
  });

  it('reopens the quote when the manager says so: the customer may pay again', async () => {
    const quote = await paidQuote('Refund and reopen');
    const res = await manager
      .post(`/api/quotes/${quote.id}/refund`)
      .send({ amountCents: quote.depositCents, afterFullRefund: 'reopen' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('sent');
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).not.toContain('Your job is booked');
    expect(page.text).toContain('Deposit refunded');
    expect(page.text).toContain('Accept and pay the deposit');
    expect(
      (await request(appUrl).post(`/api/q/${quote.token}/checkout`).set('Accept', 'application/json')).status,
    ).toBe(200);
    expect((await refundMails(quote.customerEmail))[0].text).toMatch(/open again/);
  });

  it('rejects an unknown choice by field', async () => {
    const quote = await paidQuote('Refund bad choice');
    const res = await manager
      .post(`/api/quotes/${quote.id}/refund`)
      .send({ amountCents: quote.depositCents, afterFullRefund: 'keep' });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'afterFullRefund' })]);
    expect((await manager.get(`/api/quotes/${quote.id}`)).body.status).toBe('deposit-paid');
  });
});

describe('a partial refund', () => {
  it('keeps the job booked, says what was refunded, and sends no refund notice', async () => {
    const quote = await paidQuote('Partial refund');
    const res = await manager.post(`/api/quotes/${quote.id}/refund`).send({ amountCents: 1_000 });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('deposit-paid');
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).toContain('part refunded');
    expect(await refundMails(quote.customerEmail)).toEqual([]);
  });
});
