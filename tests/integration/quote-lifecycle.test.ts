import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { waitForMailsTo } from '../support/mail';
import { dayFromToday, makeDraftQuote, makeSentQuote, payDeposit, type FixtureQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';
import { postRefund } from '../support/refunds';
import { MISSING_ID } from '../support/demo';

// The quote lifecycle (issue 12, item 2) over HTTP against the real build, MariaDB and both fakes.
// Every test makes its own quotes; dates are relative to the day the test runs.
const { appUrl, paymentsUrl } = readRuntime();

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let sequelize: Sequelize;
let counter: Agent;
let manager: Agent;
let tech: Agent;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [counter, manager, tech] = await Promise.all([
    signedInAgent('counter'),
    signedInAgent('manager'),
    signedInAgent('tech'),
  ]);
});
afterAll(() => disconnectTestDatabase());

const current = async (id: number) =>
  (await manager.get(`/api/quotes/${id}`)).body as {
    status: string;
    version: number;
    validUntil: string | null;
    snapshot: { profile: Record<string, unknown>; advice: Record<string, unknown> | null } | null;
    acceptedAt: string | null;
    closedAt: string | null;
    number: string;
    lines: unknown[];
    replacedBy: { number: string } | null;
    revisionOf: { number: string } | null;
    revision: number;
  };

async function transitions(id: number) {
  return sequelize.query<{ before: unknown; after: unknown }>(
    "SELECT `before`, `after` FROM audit_log WHERE action = 'quote.transition' AND entity_type = 'quote' AND entity_id = :id ORDER BY id",
    {
      replacements: { id: String(id) },
      type: QueryTypes.SELECT,
    },
  );
}
const parsed = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown>;

/** A quote in the named state, reached the way the app reaches it. */
async function quoteIn(state: 'draft' | 'sent' | 'accepted' | 'deposit-paid', label: string): Promise<FixtureQuote> {
  if (state === 'draft') return makeDraftQuote(counter, label);
  const sent = await makeSentQuote(counter, label);
  if (state === 'sent') return sent;
  if (state === 'deposit-paid') {
    await payDeposit(manager, sent);
    return { ...sent, version: (await current(sent.id)).version };
  }
  const accepted = await counter
    .post(`/api/quotes/${sent.id}/transition`)
    .send({ to: 'accepted', version: sent.version });
  expect(accepted.status).toBe(200);
  return { ...sent, version: accepted.body.version };
}

describe('every move staff may make', () => {
  it.each([
    ['sent', 'accepted'],
    ['sent', 'declined'],
    ['accepted', 'declined'],
    ['sent', 'expired'],
    ['accepted', 'expired'],
    ['draft', 'cancelled'],
    ['sent', 'cancelled'],
    ['accepted', 'cancelled'],
  ] as const)('%s → %s answers 200, is audited, and the quote says so', async (from, to) => {
    const quote = await quoteIn(from, `Move ${from} to ${to}`);
    const before = (await transitions(quote.id)).length;
    const res = await counter
      .post(`/api/quotes/${quote.id}/transition`)
      .send({ to, version: quote.version, reason: 'test move' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe(to);
    expect(res.body.version).toBeGreaterThan(quote.version);
    if (to === 'accepted') expect(res.body.acceptedAt).not.toBeNull();
    const audit = await transitions(quote.id);
    expect(audit).toHaveLength(before + 1);
    expect(parsed(audit.at(-1)!.before)).toEqual({ status: from });
    expect(parsed(audit.at(-1)!.after)).toMatchObject({ status: to, via: 'staff', reason: 'test move' });
  });

  it('records the moves the app makes itself: sent by the send route, deposit paid by the payment', async () => {
    const quote = await makeSentQuote(counter, 'Moves by the app');
    await payDeposit(manager, quote);
    const audit = (await transitions(quote.id)).map((row) => [
      parsed(row.before).status,
      parsed(row.after).status,
      parsed(row.after).via,
    ]);
    expect(audit).toEqual([
      ['draft', 'sent', 'send'],
      ['sent', 'deposit-paid', 'payment'],
    ]);
  });

  it('lets a manager refund an accepted-then-paid quote and reopen it (refund → sent)', async () => {
    const quote = await quoteIn('accepted', 'Accepted then paid');
    await payDeposit(manager, quote as FixtureQuote & { token: string });
    const refund = await postRefund(manager, quote.id, { amountCents: quote.depositCents, afterFullRefund: 'reopen' });
    expect(refund.status).toBe(200);
    expect(refund.body.status).toBe('sent');
    const vias = (await transitions(quote.id)).map((row) => parsed(row.after).via);
    expect(vias).toEqual(['send', 'staff', 'payment', 'refund']);
  });
});

describe('moves that are refused', () => {
  it.each([
    ['draft', 'accepted'],
    ['draft', 'closed'],
    ['draft', 'sent'], // only by sending (the e-mail is the point)
    ['sent', 'deposit-paid'], // only by the customer paying
    ['sent', 'closed'],
    ['sent', 'replaced'], // only by revising
    ['deposit-paid', 'cancelled'], // only by refunding the deposit
    ['deposit-paid', 'declined'],
    ['deposit-paid', 'sent'],
    ['deposit-paid', 'closed'], // only by paying the balance while any is left (tests/integration/balance.test.ts)
  ] as const)('%s → %s answers 409 with the current state and changes nothing', async (from, to) => {
    const quote = await quoteIn(from, `Refuse ${from} to ${to}`);
    const before = (await transitions(quote.id)).length;
    const res = await counter.post(`/api/quotes/${quote.id}/transition`).send({ to, version: quote.version });
    expect(res.status).toBe(409);
    expect(res.body.state).toMatchObject({ status: from });
    expect(Array.isArray(res.body.state.allowed)).toBe(true);
    expect(res.body.message).toEqual(expect.any(String));
    expect(res.body.current).toMatchObject({ id: quote.id, status: from, version: quote.version });
    expect((await current(quote.id)).status).toBe(from);
    expect(await transitions(quote.id)).toHaveLength(before);
  });

  it('refuses every move out of an end state', async () => {
    const quote = await quoteIn('sent', 'End state');
    const cancelled = await counter
      .post(`/api/quotes/${quote.id}/transition`)
      .send({ to: 'cancelled', version: quote.version });
    for (const to of ['sent', 'accepted', 'declined', 'expired', 'closed', 'draft']) {
      const res = await counter
        .post(`/api/quotes/${quote.id}/transition`)
        .send({ to, version: cancelled.body.version });
      expect([to, res.status, res.body.state?.status]).toEqual([to, 409, 'cancelled']);
    }
  });

  it('refuses a stale version with 409 and the quote as it is now', async () => {
    const quote = await quoteIn('sent', 'Stale move');
    const res = await counter
      .post(`/api/quotes/${quote.id}/transition`)
      .send({ to: 'declined', version: quote.version - 1 });
    expect(res.status).toBe(409);
    expect(res.body.current).toMatchObject({ status: 'sent', version: quote.version });
  });

  it('will not accept a quote past its valid-until day', async () => {
    const quote = await makeSentQuote(counter, 'Lapsed accept', { validUntil: dayFromToday(-1) });
    const res = await counter
      .post(`/api/quotes/${quote.id}/transition`)
      .send({ to: 'accepted', version: quote.version });
    expect(res.status).toBe(409);
    expect(res.body.state).toMatchObject({ status: 'sent', expired: true });
    expect(res.body.message).toMatch(/valid until/);
  });

  it('names the field for bad input (422), keeps technicians out (403) and 404s a missing quote', async () => {
    const quote = await quoteIn('sent', 'Bad move input');
    const bad = await counter
      .post(`/api/quotes/${quote.id}/transition`)
      .send({ to: 'paid-in-full', version: quote.version });
    expect(bad.status).toBe(422);
    expect(bad.body.errors).toEqual([expect.objectContaining({ field: 'to' })]);
    const noVersion = await counter.post(`/api/quotes/${quote.id}/transition`).send({ to: 'declined' });
    expect(noVersion.status).toBe(422);
    expect(noVersion.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
    expect(
      (await tech.post(`/api/quotes/${quote.id}/transition`).send({ to: 'declined', version: quote.version })).status,
    ).toBe(403);
    expect(
      (await counter.post(`/api/quotes/${MISSING_ID}/transition`).send({ to: 'declined', version: 1 })).status,
    ).toBe(404);
  });
});

describe('revising a sent quote', () => {
  it('makes a draft -R2 with the same lines; the old link says it was replaced and how to reach the new one', async () => {
    const old = await makeSentQuote(counter, 'Revise me');
    const oldLines = (await current(old.id)).lines;
    const res = await counter.post(`/api/quotes/${old.id}/revise`).send({ version: old.version });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      number: `${old.number}-R2`,
      status: 'draft',
      revision: 2,
      revisionOf: { id: old.id, number: old.number },
    });
    expect(
      res.body.lines.map((l: { description: string; totalCents: number }) => [l.description, l.totalCents]),
    ).toEqual((oldLines as { description: string; totalCents: number }[]).map((l) => [l.description, l.totalCents]));
    const before = await current(old.id);
    expect(before).toMatchObject({ status: 'replaced', replacedBy: { number: `${old.number}-R2` } });

    const page = await request(appUrl).get(`/q/${old.token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('replaced by a newer quote');
    expect(page.text).toContain(`${old.number}-R2`);
    expect(page.text).not.toContain('Accept and pay the deposit');
    const pay = await request(appUrl).post(`/api/q/${old.token}/checkout`).set('Accept', 'application/json');
    expect(pay.status).toBe(409);
    expect(pay.body.state.status).toBe('replaced');

    // Sending the revision e-mails the new link, saying which quote it replaces; the old page says where it went.
    const sent = await counter.post(`/api/quotes/${res.body.id}/send`);
    expect(sent.status).toBe(200);
    const mails = await waitForMailsTo(old.customerEmail, 2);
    const revised = mails.find((m) => m.subject.includes(`${old.number}-R2`))!;
    expect(revised.subject).toMatch(/revised/i);
    expect(revised.text).toContain(`replaces ${old.number}`);
    expect(revised.html).toContain(`${old.number}-R2`);
    const after = await request(appUrl).get(`/q/${old.token}`);
    expect(after.text).toContain('We e-mailed the newer quote');

    // A second revision counts on: -R3, and the quote numbering for new quotes is untouched.
    const third = await counter.post(`/api/quotes/${res.body.id}/revise`).send({ version: sent.body.version });
    expect(third.status).toBe(201);
    expect(third.body.number).toBe(`${old.number}-R3`);
    const fresh = await makeDraftQuote(counter, 'After revisions');
    expect(fresh.number).toMatch(/^Q-\d{4}-\d{4}$/);
  });

  it('gives back money paid after the revision on a checkout opened before it, and never counts it', async () => {
    const old = await makeSentQuote(counter, 'Paid after revise');
    const started = await request(appUrl).post(`/api/q/${old.token}/checkout`).set('Accept', 'application/json');
    expect(started.status).toBe(200);
    expect((await counter.post(`/api/quotes/${old.id}/revise`).send({ version: old.version })).status).toBe(201);
    await request(paymentsUrl)
      .post(`/_test/sessions/${new URL(started.body.url).pathname.split('/').pop()}/complete`)
      .expect(200);
    const deadline = Date.now() + 15_000;
    let after = (await manager.get(`/api/quotes/${old.id}`)).body;
    while (after.payments[0]?.status !== 'refunded' && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 150));
      after = (await manager.get(`/api/quotes/${old.id}`)).body;
    }
    expect(after.status).toBe('replaced');
    expect(after.paidCents - after.refundedCents).toBe(0); // taken and given back: nothing held
    expect(after.payments[0]).toMatchObject({ status: 'refunded', refundedCents: old.depositCents });
  });

  it('refuses to revise a draft or a paid quote (409 with the state)', async () => {
    const draft = await quoteIn('draft', 'Revise draft');
    const res = await counter.post(`/api/quotes/${draft.id}/revise`).send({ version: draft.version });
    expect(res.status).toBe(409);
    expect(res.body.state.status).toBe('draft');
    const paid = await quoteIn('deposit-paid', 'Revise paid');
    const paidRes = await counter.post(`/api/quotes/${paid.id}/revise`).send({ version: paid.version });
    expect(paidRes.status).toBe(409);
    expect(paidRes.body.state.status).toBe('deposit-paid');
  });
});

describe('valid-until and the frozen snapshot', () => {
  it('sets valid-until on the first send and lets staff move it, never into the past', async () => {
    const quote = await makeSentQuote(counter, 'Valid until');
    const sent = await current(quote.id);
    // Thirty days from the send (the test may straddle midnight UTC, hence either day).
    expect([dayFromToday(30), dayFromToday(29)]).toContain(sent.validUntil);
    const past = await counter
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: sent.version, validUntil: dayFromToday(-2) });
    expect(past.status).toBe(422);
    expect(past.body.errors).toEqual([expect.objectContaining({ field: 'validUntil' })]);
    const later = await counter
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: sent.version, validUntil: dayFromToday(45) });
    expect(later.status).toBe(200);
    expect(later.body.validUntil).toBe(dayFromToday(45));
    const lines = await counter.patch(`/api/quotes/${quote.id}`).send({
      version: later.body.version,
      lines: [{ kind: 'other', description: 'Shop towel', quantity: 1, unitPriceCents: 100 }],
    });
    expect(lines.status).toBe(409);
  });

  it('keeps the build profile and advice as they were sent when the build is edited later', async () => {
    const draft = await makeDraftQuote(counter, 'Snapshot');
    expect((await current(draft.id)).snapshot).toBeNull();
    expect((await counter.post(`/api/quotes/${draft.id}/send`)).status).toBe(200);
    const frozen = (await current(draft.id)).snapshot!;
    expect(frozen.profile).toMatchObject({ drivetrain: { stallRpm: 2000 }, use: { primary: 'towing' } });
    expect(frozen.advice).toMatchObject({ camId: expect.anything(), reasons: expect.any(Array) });

    const build = (await counter.get(`/api/builds/${draft.buildId}`)).body;
    const profile = { ...build.profile, drivetrain: { ...build.profile.drivetrain, stallRpm: 3200 } };
    const edited = await counter.patch(`/api/builds/${draft.buildId}`).send({ version: build.version, profile });
    expect(edited.status).toBe(200);
    expect((await counter.get(`/api/builds/${draft.buildId}`)).body.profile.drivetrain.stallRpm).toBe(3200);

    // Sending again (a new link) still keeps the first snapshot.
    expect((await counter.post(`/api/quotes/${draft.id}/send`)).status).toBe(200);
    const after = (await current(draft.id)).snapshot!;
    expect(after).toEqual(frozen);
    expect(after.profile).toMatchObject({ drivetrain: { stallRpm: 2000 } });
  });
});
