import { QueryTypes, type Sequelize } from 'sequelize';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { editableLine, makeDraftQuote } from '../support/quote-fixtures';
import { DEMO } from '../support/demo';
import type { QuoteRecord } from '@/lib/quotes/types';

// Price authority (issue 12, item 8), over HTTP against the real build and MariaDB. Counter staff sell
// catalogue items at the catalogue price, give discounts up to the manager's limit (shop settings,
// 5 % unless changed; more waits for a manager's approval, see discount-approval.test.ts), and cannot move
// a line to an untaxed kind; a manager may, and is audited.
// Every test makes its own customer, build and draft.

type Quote = QuoteRecord;

let sequelize: Sequelize;
let counter: Awaited<ReturnType<typeof signedInAgent>>;
let manager: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [counter, manager] = await Promise.all([signedInAgent('counter'), signedInAgent('manager')]);
});
afterAll(() => disconnectTestDatabase());

const read = async (id: number) => (await manager.get(`/api/quotes/${id}`)).body as Quote;
const camLineIndex = (q: Quote) => q.lines.findIndex((l) => l.kind === 'cam');
const audits = async (action: string, quoteId: number) =>
  Number(
    (
      await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM audit_log WHERE action = ? AND entity_id = ?', {
        replacements: [action, String(quoteId)],
        type: QueryTypes.SELECT,
      })
    )[0].n,
  );

describe('counter staff and prices', () => {
  it('cannot set a cam line to 1 cent: 403 naming the price, nothing saved', async () => {
    const quote = (await read((await makeDraftQuote(counter, 'One cent cam')).id)) as Quote;
    const lines = quote.lines.map(editableLine);
    const i = camLineIndex(quote);
    lines[i].unitPriceCents = 1;
    const res = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
    expect(res.status).toBe(403);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: `lines.${i}.unitPriceCents` })]);
    expect(await read(quote.id)).toMatchObject({ totalCents: quote.totalCents, version: quote.version });
  });

  it('cannot change a catalogue line’s kind to dodge tax (422 naming kind), for anyone', async () => {
    const quote = await read((await makeDraftQuote(counter, 'Kind dodge')).id);
    const lines = quote.lines.map(editableLine);
    const i = camLineIndex(quote);
    lines[i].kind = 'labor';
    for (const staff of [counter, manager]) {
      const res = await staff.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: `lines.${i}.kind` })]);
    }
    expect((await read(quote.id)).taxCents).toBe(quote.taxCents);
  });

  it('adds free lines only as taxed "other" lines; an untaxed free line needs a manager', async () => {
    const quote = await read((await makeDraftQuote(counter, 'Free lines')).id);
    const lines = [
      ...quote.lines.map(editableLine),
      { kind: 'labor', description: 'Cam swap, our price', quantity: 1, unitPriceCents: 1 },
    ];
    const refused = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
    expect(refused.status).toBe(403);
    expect(refused.body.errors).toEqual([expect.objectContaining({ field: `lines.${lines.length - 1}.kind` })]);
    const supplies = [
      ...quote.lines.map(editableLine),
      { kind: 'other', description: 'Shop supplies', quantity: 1, unitPriceCents: 1_999 },
    ];
    const ok = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines: supplies });
    expect(ok.status).toBe(200);
    expect(ok.body.subtotalCents).toBe(quote.subtotalCents + 1_999);
  });

  it('gets 403 naming extraLines when a new quote’s extra line is priced off the catalogue', async () => {
    const res = await counter.post('/api/quotes').send({
      buildId: DEMO.builds.whitlockTowingTruck,
      camId: DEMO.cams.bigTruck219,
      extraLines: [{ kind: 'labor', laborOperationId: DEMO.labor.camSwapTruck, unitPriceCents: 100 }],
    });
    expect(res.status).toBe(403);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'extraLines.0.unitPriceCents' })]);
  });
});

describe('discounts', () => {
  it('counter staff give a discount within the limit; it comes off before tax', async () => {
    const quote = await read((await makeDraftQuote(counter, 'Small discount')).id);
    const lines = quote.lines.map(editableLine);
    const i = camLineIndex(quote);
    const gross = quote.lines.reduce((s, l) => s + l.totalCents, 0);
    const discount = Math.floor((gross * 300) / 10_000); // 3 % of the job, under the default 5 %
    expect(discount).toBeLessThanOrEqual(lines[i].unitPriceCents);
    lines[i].discountCents = discount;
    const res = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
    expect(res.status).toBe(200);
    const saved = res.body as Quote;
    expect(saved.lines[i]).toMatchObject({ discountCents: discount, totalCents: lines[i].unitPriceCents - discount });
    expect(saved.subtotalCents).toBe(quote.subtotalCents - discount);
    // The cam is taxed goods: tax falls on the discounted amount, rounded half up once.
    const goods = saved.lines
      .filter((l) => ['cam', 'part', 'other'].includes(l.kind))
      .reduce((s, l) => s + l.totalCents, 0);
    expect(saved.taxCents).toBe(Math.floor((goods * saved.taxRateBp + 5_000) / 10_000));
    expect(saved.totalCents).toBe(saved.subtotalCents + saved.taxCents);
  });

  it('above the limit: counter staff’s save waits for a manager, a manager’s own is approved; both audited', async () => {
    const quote = await read((await makeDraftQuote(counter, 'Big discount')).id);
    const lines = quote.lines.map(editableLine);
    const i = camLineIndex(quote);
    const gross = quote.lines.reduce((s, l) => s + l.totalCents, 0);
    lines[i].discountCents = Math.min(lines[i].unitPriceCents, Math.ceil((gross * 800) / 10_000)); // about 8 %
    const waiting = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
    expect(waiting.status).toBe(200);
    expect((waiting.body as Quote).discountApproval).toMatchObject({ state: 'pending', approvedBy: null });
    const allowed = await manager
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: (waiting.body as Quote).version, lines });
    expect(allowed.status).toBe(200);
    expect((allowed.body as Quote).discountApproval).toMatchObject({
      state: 'approved',
      approvedBy: { id: DEMO.users.manager },
    });
    expect(await audits('quote.discount-over-limit', quote.id)).toBe(2);
  });

  it('follows the limit the manager sets in the shop settings', async () => {
    const before = (await manager.get('/api/settings')).body as { version: number; maxCounterDiscountBp: number };
    expect(before.maxCounterDiscountBp).toBe(500);
    const raised = await manager.patch('/api/settings').send({ version: before.version, maxCounterDiscountBp: 1_000 });
    expect(raised.status).toBe(200);
    try {
      expect(
        (await counter.patch('/api/settings').send({ version: raised.body.version, maxCounterDiscountBp: 10_000 }))
          .status,
      ).toBe(403);
      const quote = await read((await makeDraftQuote(counter, 'Raised limit')).id);
      const lines = quote.lines.map(editableLine);
      const i = camLineIndex(quote);
      const gross = quote.lines.reduce((s, l) => s + l.totalCents, 0);
      lines[i].discountCents = Math.min(lines[i].unitPriceCents, Math.floor((gross * 800) / 10_000));
      const saved = await counter.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
      expect(saved.status).toBe(200);
      expect((saved.body as Quote).discountApproval.state).toBe('none');
    } finally {
      const now = (await manager.get('/api/settings')).body as { version: number };
      await manager
        .patch('/api/settings')
        .send({ version: now.version, maxCounterDiscountBp: before.maxCounterDiscountBp })
        .expect(200);
    }
  });
});

describe('managers override prices', () => {
  it('a manager’s price stands, is audited, and counter staff may keep it while editing other lines', async () => {
    const quote = await read((await makeDraftQuote(counter, 'Manager price')).id);
    const lines = quote.lines.map(editableLine);
    const i = camLineIndex(quote);
    lines[i].unitPriceCents -= 2_500;
    const overridden = await manager.patch(`/api/quotes/${quote.id}`).send({ version: quote.version, lines });
    expect(overridden.status).toBe(200);
    expect(overridden.body.lines[i].unitPriceCents).toBe(lines[i].unitPriceCents);
    expect(await audits('quote.price-override', quote.id)).toBe(1);
    const kept = [...lines, { kind: 'other', description: 'Shop supplies', quantity: 1, unitPriceCents: 999 }];
    const edited = await counter
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: overridden.body.version, lines: kept });
    expect(edited.status).toBe(200);
    expect(edited.body.lines[i].unitPriceCents).toBe(lines[i].unitPriceCents);
  });
});
