import { QueryTypes, type Sequelize } from 'sequelize';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO } from '../support/demo';
import { editableLine, makeDraftQuote } from '../support/quote-fixtures';
import type { QuoteRecord } from '@/lib/quotes/types';

// A manager's approval of a counter discount above the shop's limit (issue 12, item 8), over HTTP against
// the real build and MariaDB. Counter staff may save more than the limit (5 % in the demo settings); the
// quote then waits for a manager and cannot be sent until one approves it. Every test makes its own draft.

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

const read = async (id: number) => (await manager.get(`/api/quotes/${id}`)).body as QuoteRecord;

/** The quote's lines with about `shareBp` of each line (so of the job, before discounts) taken off. */
function withDiscount(quote: QuoteRecord, shareBp: number) {
  return quote.lines.map((l) => ({
    ...editableLine(l),
    discountCents: Math.ceil(((l.totalCents + l.discountCents) * shareBp) / 10_000),
  }));
}

async function auditCount(action: string, quoteId: number): Promise<number> {
  const [row] = await sequelize.query<{ n: number }>(
    'SELECT COUNT(*) AS n FROM audit_log WHERE action = ? AND entity_id = ?',
    { replacements: [action, String(quoteId)], type: QueryTypes.SELECT },
  );
  return Number(row.n);
}

/** A counter user's draft saved with about 12 % off: above the demo's 5 % limit. */
async function pendingDraft(label: string): Promise<QuoteRecord> {
  const quote = await read((await makeDraftQuote(counter, label)).id);
  const saved = await counter
    .patch(`/api/quotes/${quote.id}`)
    .send({ version: quote.version, lines: withDiscount(quote, 1_200) });
  expect(saved.status).toBe(200);
  return saved.body as QuoteRecord;
}

describe('a counter discount above the limit', () => {
  it('is saved as pending, cannot be sent (409), counter staff cannot approve it, a manager can, then it sends', async () => {
    const pending = await pendingDraft('Pending discount');
    expect(pending.discountApproval).toMatchObject({ state: 'pending', approvedBy: null, approvedAt: null });
    expect(pending.discountApproval.discountBp).toBeGreaterThan(500);
    const listed = await counter.get('/api/quotes').query({ q: pending.number });
    const item = (listed.body.items as { id: number }[]).find((i) => i.id === pending.id);
    expect(item).toMatchObject({ discountApproval: 'pending' });

    const blocked = await counter.post(`/api/quotes/${pending.id}/send`);
    expect(blocked.status).toBe(409);
    expect(blocked.body.message).toMatch(/pending discount approval/);
    expect(blocked.body.message).toContain(pending.number);
    expect(blocked.body.discountApproval).toBe('pending');
    // Nothing moved: still a draft with no link, the same version.
    expect(await read(pending.id)).toMatchObject({ status: 'draft', sentAt: null, version: pending.version });
    // A manager cannot send it past the approval either: approving is its own, audited step.
    expect((await manager.post(`/api/quotes/${pending.id}/send`)).status).toBe(409);

    for (const staff of [counter, tech]) {
      const refused = await staff.post(`/api/quotes/${pending.id}/approve-discount`).send({ version: pending.version });
      expect(refused.status).toBe(403);
    }
    expect((await read(pending.id)).discountApproval.state).toBe('pending');

    const approved = await manager
      .post(`/api/quotes/${pending.id}/approve-discount`)
      .send({ version: pending.version });
    expect(approved.status).toBe(200);
    const record = approved.body as QuoteRecord;
    expect(record.discountApproval).toMatchObject({ state: 'approved', approvedBy: { id: DEMO.users.manager } });
    expect(Date.parse(record.discountApproval.approvedAt!)).not.toBeNaN();
    expect(record.version).toBeGreaterThan(pending.version);
    expect(await auditCount('quote.discount-approved', pending.id)).toBe(1);

    const sent = await counter.post(`/api/quotes/${pending.id}/send`);
    expect(sent.status).toBe(200);
    expect(sent.body).toMatchObject({ status: 'sent', discountApproval: { state: 'approved' } });
  });

  it('goes back to pending when counter staff raise the discount again after the approval', async () => {
    const pending = await pendingDraft('Raised again');
    const approved = (
      await manager.post(`/api/quotes/${pending.id}/approve-discount`).send({ version: pending.version }).expect(200)
    ).body as QuoteRecord;

    // Counter staff may edit other lines without raising the share: the approval stands.
    const kept = await counter
      .patch(`/api/quotes/${pending.id}`)
      .send({ version: approved.version, lines: approved.lines.map(editableLine) });
    expect(kept.status).toBe(200);
    expect((kept.body as QuoteRecord).discountApproval.state).toBe('approved');

    const raised = await counter
      .patch(`/api/quotes/${pending.id}`)
      .send({ version: kept.body.version, lines: withDiscount(approved, 2_000) });
    expect(raised.status).toBe(200);
    expect((raised.body as QuoteRecord).discountApproval).toMatchObject({ state: 'pending', approvedBy: null });
    expect((await counter.post(`/api/quotes/${pending.id}/send`)).status).toBe(409);

    // Back within the limit: nothing to approve, and sending is no longer blocked by it.
    const lowered = await counter
      .patch(`/api/quotes/${pending.id}`)
      .send({ version: raised.body.version, lines: withDiscount(approved, 300) });
    expect((lowered.body as QuoteRecord).discountApproval.state).toBe('none');
    expect((await counter.post(`/api/quotes/${pending.id}/send`)).status).toBe(200);
  });

  it('needs no approval when a manager gives it', async () => {
    const quote = await read((await makeDraftQuote(manager, 'Manager discount')).id);
    const saved = await manager
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: quote.version, lines: withDiscount(quote, 1_500) });
    expect(saved.status).toBe(200);
    expect((saved.body as QuoteRecord).discountApproval).toMatchObject({
      state: 'approved',
      approvedBy: { id: DEMO.users.manager },
    });
  });

  it('refuses a stale or needless approval with 409, and a body without a version with 422 naming it', async () => {
    const pending = await pendingDraft('Stale approval');
    const missing = await manager.post(`/api/quotes/${pending.id}/approve-discount`).send({});
    expect(missing.status).toBe(422);
    expect(missing.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);

    const stale = await manager
      .post(`/api/quotes/${pending.id}/approve-discount`)
      .send({ version: pending.version - 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ id: pending.id, version: pending.version });
    expect((await read(pending.id)).discountApproval.state).toBe('pending');

    const small = await read((await makeDraftQuote(counter, 'Nothing to approve')).id);
    const needless = await manager.post(`/api/quotes/${small.id}/approve-discount`).send({ version: small.version });
    expect(needless.status).toBe(409);
    expect(needless.body.message).toMatch(/no discount waiting for approval/);
  });
});
