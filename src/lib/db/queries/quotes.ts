import crypto from 'node:crypto';
import { col, fn, Op, type Transaction } from 'sequelize';
import { rankForShop } from '@/lib/advisor-service';
import { canSeeCosts } from '@/lib/auth/costs';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, invalid, notFound, refused, runWrite, type WriteOutcome } from '@/lib/catalogue/versioned-write';
import { appBaseUrl } from '@/lib/env';
import type { FieldError } from '@/lib/http/responses';
import { sendMail } from '@/lib/mail';
import { payments } from '@/lib/payments';
import type { AuthorityVerdict } from '@/lib/quotes/authority';
import { jobLines } from '@/lib/quotes/job-price';
import { formatQuoteNumber, lineNetCents, lineTotalCents, nextQuoteSequence, quoteTotals, type QuoteLineKind } from '@/lib/quotes/pricing';
import { stateWord, validUntilFrom } from '@/lib/quotes/lifecycle';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import type { QuoteLineInput } from '@/lib/schemas/quote';
import { balanceDueCents, counts, moneyIn, type PaymentMethod, type PaymentPurpose } from '@/lib/quotes/balance';
import { Build, Cam, Customer, db, Part, Payment, Quote, QuoteLine, ShopSettings, User } from '../models';
import { quoteIdByLinkHash } from './quote-links';
import { catalogueKey, PriceAuthorityRefused, resolveLines, type LineDraft } from './quote-lines';
import { sendRefundNotice, settleFullRefund, type AfterFullRefund } from './refund-effects';
import { LifecycleRefused, moveQuote } from './quote-lifecycle';
import { mailShop, quoteSentMail } from './quote-notices';
import { readJson, takeSnapshot, type QuoteSnapshot } from './quote-snapshot';
import type { QuoteStatus } from '../models/quote';

// Quotes: made from a build and a chosen cam, priced by src/lib/quotes/pricing.ts, sent by private
// link, paid by deposit through the payments SDK. Every write runs in one transaction.

export type QuoteLineRecord = {
  id: number;
  kind: QuoteLineKind;
  camId: number | null;
  partId: number | null;
  laborOperationId: number | null;
  description: string;
  quantity: number;
  unitPriceCents: number;
  /** Taken off this line before tax; totalCents is after it. */
  discountCents: number;
  totalCents: number;
  sortOrder: number;
  /** What the shop pays for one unit (catalogue cost of the cam or part); null for labour and free lines. */
  unitCostCents?: number | null;
};

export type PaymentRecord = {
  id: number;
  status: Payment['status'];
  amountCents: number;
  refundedCents: number;
  currency: string;
  providerSessionId: string | null;
  providerPaymentId: string | null;
  paidAt: string | null;
  /** A second paid checkout for an already paid quote: refunded automatically, never counted. */
  duplicateOfPaymentId: number | null;
  /** 'deposit' books the job, 'balance' is the rest; 'online' or taken at the counter (cash, card). */
  purpose: PaymentPurpose;
  method: PaymentMethod;
  /** Who took a counter payment. */
  recordedBy: { id: number; name: string } | null;
  createdAt: string;
};

export type QuoteRecord = {
  id: number;
  number: string;
  status: QuoteStatus;
  /** The state in words (src/lib/quotes/lifecycle.ts), as every screen says it. */
  stateWord: string;
  revision: number;
  /** The quote this revision replaces, and the newer revision that replaced this one. */
  revisionOf: { id: number; number: string } | null;
  replacedBy: { id: number; number: string; status: QuoteStatus; sentAt: string | null } | null;
  /** Frozen at the first send; null for a draft. */
  snapshot: QuoteSnapshot | null;
  closedAt: string | null;
  customer: { id: number; name: string; email: string | null };
  build: { id: number; vehicleLabel: string } | null;
  camId: number | null;
  lines: QuoteLineRecord[];
  subtotalCents: number;
  taxRateBp: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  /** Every payment taken (deposits and balance), before refunds; refunded duplicates never count. */
  paidCents: number;
  refundedCents: number;
  depositPaidCents: number;
  balancePaidCents: number;
  /** total − (paid − refunded), never below zero (src/lib/quotes/balance.ts). */
  balanceDueCents: number;
  /** When staff last e-mailed the pay-the-balance link. */
  balanceRequestedAt: string | null;
  validUntil: string | null;
  sentAt: string | null;
  acceptedAt: string | null;
  payments: PaymentRecord[];
  /** Goods cost and margin; left out for technicians (see presentQuote). */
  costCents?: number;
  marginCents?: number;
  version: number;
  createdAt: string;
  updatedAt: string;
};

type PaymentRow = Payment & { recordedBy?: User | null };
type QuoteRow = Quote & { customer?: Customer; build?: Build | null; lines?: (QuoteLine & { cam?: Cam | null; part?: Part | null })[]; payments?: PaymentRow[] };

const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null);

function include() {
  return [
    { model: Customer, as: 'customer', attributes: ['id', 'name', 'email'] },
    { model: Build, as: 'build', attributes: ['id', 'vehicleLabel'] },
    { model: QuoteLine, as: 'lines' },
    { model: Payment, as: 'payments', include: [{ model: User, as: 'recordedBy', attributes: ['id', 'name'] }] },
  ];
}

function paymentRecord(p: PaymentRow): PaymentRecord {
  return {
    id: p.id,
    status: p.status,
    amountCents: p.amountCents,
    refundedCents: p.refundedCents,
    currency: p.currency,
    providerSessionId: p.providerSessionId,
    providerPaymentId: p.providerPaymentId,
    paidAt: iso(p.paidAt),
    duplicateOfPaymentId: p.duplicateOfPaymentId ?? null,
    purpose: p.purpose ?? 'deposit',
    method: p.method ?? 'online',
    recordedBy: p.recordedBy ? { id: p.recordedBy.id, name: p.recordedBy.name } : null,
    createdAt: iso(p.createdAt)!,
  };
}

const PAID_STATES: readonly Payment['status'][] = ['paid', 'partially-refunded', 'refunded'];

async function toQuoteRecord(row: QuoteRow, transaction?: Transaction): Promise<QuoteRecord> {
  const lines = [...(row.lines ?? [])].sort((a, b) => a.sortOrder - b.sortOrder || a.id - b.id);
  const camIds = lines.map((l) => l.camId).filter((v): v is number => v !== null);
  const partIds = lines.map((l) => l.partId).filter((v): v is number => v !== null);
  const [cams, parts] = await Promise.all([
    camIds.length ? Cam.findAll({ where: { id: camIds }, attributes: ['id', 'costCents'], transaction }) : [],
    partIds.length ? Part.findAll({ where: { id: partIds }, attributes: ['id', 'costCents'], transaction }) : [],
  ]);
  const camCost = new Map(cams.map((c) => [c.id, c.costCents]));
  const partCost = new Map(parts.map((p) => [p.id, p.costCents]));
  let costCents = 0;
  let goodsCents = 0;
  const lineRecords = lines.map((l): QuoteLineRecord => {
    const unitCostCents = l.camId !== null ? (camCost.get(l.camId) ?? null) : l.partId !== null ? (partCost.get(l.partId) ?? null) : null;
    const quantity = Number(l.quantity);
    if (unitCostCents !== null) {
      costCents += lineTotalCents(quantity, unitCostCents);
      goodsCents += l.totalCents;
    }
    return {
      id: l.id, kind: l.kind, camId: l.camId ?? null, partId: l.partId ?? null, laborOperationId: l.laborOperationId ?? null,
      description: l.description, quantity, unitPriceCents: l.unitPriceCents, discountCents: l.discountCents ?? 0, totalCents: l.totalCents, sortOrder: l.sortOrder, unitCostCents,
    };
  });
  const pays = [...(row.payments ?? [])].sort((a, b) => a.id - b.id);
  // A refunded duplicate took the money and gave it back; the quote was paid once.
  const paid = pays.filter((p) => PAID_STATES.includes(p.status) && !p.duplicateOfPaymentId);
  const records = pays.map(paymentRecord);
  const money = moneyIn(records);
  const relatedIds = [row.revisionOfQuoteId, row.replacedByQuoteId].filter((v): v is number => typeof v === 'number');
  const related = relatedIds.length ? await Quote.findAll({ where: { id: relatedIds }, attributes: ['id', 'number', 'status', 'sentAt'], transaction }) : [];
  const older = related.find((q) => q.id === row.revisionOfQuoteId);
  const newer = related.find((q) => q.id === row.replacedByQuoteId);
  const profile = readJson(row.snapshotProfile);
  return {
    id: row.id,
    number: row.number,
    status: row.status,
    stateWord: stateWord(row.status),
    revision: row.revision ?? 1,
    revisionOf: older ? { id: older.id, number: older.number } : null,
    replacedBy: newer ? { id: newer.id, number: newer.number, status: newer.status, sentAt: iso(newer.sentAt) } : null,
    snapshot: profile === null ? null : { profile, advice: (readJson(row.snapshotAdvice) as Record<string, unknown> | null) ?? null },
    closedAt: iso(row.closedAt),
    customer: { id: row.customer?.id ?? row.customerId, name: row.customer?.name ?? 'Unknown customer', email: row.customer?.email ?? null },
    build: row.build ? { id: row.build.id, vehicleLabel: row.build.vehicleLabel } : null,
    camId: row.camId ?? null,
    lines: lineRecords,
    subtotalCents: row.subtotalCents,
    taxRateBp: row.taxRateBp,
    taxCents: row.taxCents,
    totalCents: row.totalCents,
    depositCents: row.depositCents,
    paidCents: paid.reduce((s, p) => s + p.amountCents, 0),
    refundedCents: money.refundedCents,
    depositPaidCents: money.depositsCents,
    balancePaidCents: money.balancePaidCents,
    balanceDueCents: balanceDueCents(row.totalCents, records),
    balanceRequestedAt: iso(row.balanceRequestedAt),
    validUntil: row.validUntil ?? null,
    sentAt: iso(row.sentAt),
    acceptedAt: iso(row.acceptedAt),
    payments: records,
    costCents,
    marginCents: goodsCents - costCents,
    version: row.version,
    createdAt: iso(row.createdAt)!,
    updatedAt: iso(row.updatedAt)!,
  };
}

/** Technicians read quotes without costs or margins. */
export function presentQuote(record: QuoteRecord, user: SessionUser): QuoteRecord {
  if (canSeeCosts(user)) return record;
  const { costCents: _c, marginCents: _m, ...rest } = record;
  void _c;
  void _m;
  return { ...rest, lines: rest.lines.map(({ unitCostCents: _u, ...line }) => (void _u, line)) };
}

export async function getQuote(id: number, transaction?: Transaction): Promise<QuoteRecord | null> {
  db();
  const row = (await Quote.findByPk(id, { include: include(), transaction })) as QuoteRow | null;
  return row ? toQuoteRecord(row, transaction) : null;
}

// ---- Building lines (checked against the catalogue and the user's price authority in ./quote-lines) ----

export type QuoteWriteOutcome = WriteOutcome<QuoteRecord> | { ok: false; reason: 'forbidden'; errors: FieldError[] };

/** Counter staff asking for what only a manager may give: 403 naming the fields, nothing written. */
async function withPriceAuthority(write: () => Promise<WriteOutcome<QuoteRecord>>): Promise<QuoteWriteOutcome> {
  try {
    return await write();
  } catch (error) {
    if (error instanceof PriceAuthorityRefused) return { ok: false, reason: 'forbidden', errors: error.errors };
    throw error;
  }
}

/** What a manager allowed beyond the counter's authority, one audit row each. */
async function auditAuthority(verdict: AuthorityVerdict, limitBp: number, user: SessionUser, quoteId: number, t: Transaction) {
  if (verdict.overrides.length) {
    await recordAudit({ user, action: 'quote.price-override', entityType: 'quote', entityId: quoteId, after: { overrides: verdict.overrides } }, t);
  }
  if (verdict.discountOverLimit) {
    await recordAudit({ user, action: 'quote.discount-over-limit', entityType: 'quote', entityId: quoteId, after: { discountBp: verdict.discountBp, counterLimitBp: limitBp } }, t);
  }
}

async function shopSettings(t: Transaction): Promise<ShopSettings> {
  const settings = await ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t });
  if (!settings) throw refused('The shop settings are missing; a manager has to set the labour rate, tax and deposit first.');
  return settings;
}

const policyOf = (s: ShopSettings) => ({ percentBp: s.depositPercentBp, minCents: s.depositMinCents, maxCents: s.depositMaxCents });

async function writeLines(quoteId: number, lines: LineDraft[], t: Transaction) {
  await QuoteLine.destroy({ where: { quoteId }, transaction: t });
  await QuoteLine.bulkCreate(
    lines.map((l, i) => ({ ...l, quoteId, quantity: l.quantity.toFixed(2), totalCents: lineNetCents(l), sortOrder: i })),
    { transaction: t },
  );
}

async function nextNumber(t: Transaction): Promise<string> {
  const year = new Date().getUTCFullYear();
  // The locking read serialises concurrent creators on the year's range; the unique index is the backstop.
  const last = await Quote.findOne({
    // Revisions (-R2, -R3) share their first quote's number and never advance the count.
    where: { number: { [Op.like]: `Q-${year}-%`, [Op.notLike]: '%-R%' } },
    order: [[fn('LENGTH', col('number')), 'DESC'], ['number', 'DESC']],
    attributes: ['id', 'number'],
    lock: t.LOCK.UPDATE,
    transaction: t,
  });
  return formatQuoteNumber(year, nextQuoteSequence(last?.number ?? null, year));
}

export type CreateQuoteInput = { buildId: number; camId: number; extraLines?: QuoteLineInput[] };

/** A draft from a saved build and a chosen cam: the cam, what the need rules add, the staff's extra lines. */
export async function createQuoteFromBuild(input: CreateQuoteInput, user: SessionUser): Promise<QuoteWriteOutcome> {
  db();
  const build = await Build.findByPk(input.buildId);
  const cam = await Cam.findByPk(input.camId);
  const errors: FieldError[] = [];
  if (!build) errors.push({ field: 'buildId', message: `there is no build with id ${input.buildId}` });
  if (!cam) errors.push({ field: 'camId', message: `there is no cam with id ${input.camId}` });
  else if (cam.isFactoryBaseline) errors.push({ field: 'camId', message: 'a factory baseline card is a reference, not a cam the shop sells' });
  if (errors.length || !build || !cam) return { ok: false, reason: 'invalid', errors };
  const profile = BuildProfileSchema.safeParse(build.profile);
  if (!profile.success) return { ok: false, reason: 'invalid', errors: [{ field: 'buildId', message: 'the saved build is incomplete; finish the interview first' }] };
  const ranked = await rankForShop(profile.data, { camIds: [cam.id], includeCurves: false });
  const ranking = ranked.ok ? ranked.result.rankings.find((r) => String(r.camId) === String(cam.id)) : undefined;
  if (!ranking) return { ok: false, reason: 'invalid', errors: [{ field: 'camId', message: 'the advisor could not rank this cam for this build' }] };

  for (let attempt = 0; ; attempt++) {
    const outcome = await withPriceAuthority(() => runWrite(async (t) => {
      const settings = await shopSettings(t);
      // The very lines the shortlist priced (jobLines), so the draft's pre-tax total is its job price.
      const lines: LineDraft[] = jobLines({ id: cam.id, description: `${cam.sku} ${cam.name}`, priceCents: cam.priceCents }, ranking.neededItems, settings.laborRateCents);
      const extra = await resolveLines(input.extraLines ?? [], { field: 'extraLines', laborRateCents: settings.laborRateCents, maxCounterDiscountBp: settings.maxCounterDiscountBp, user }, t);
      lines.push(...extra.lines);
      const totals = quoteTotals(lines, settings.taxRateBp, policyOf(settings));
      const quote = await Quote.create(
        {
          number: await nextNumber(t), customerId: build.customerId, buildId: build.id, camId: cam.id, createdByUserId: user.id, status: 'draft',
          publicTokenHash: null, subtotalCents: totals.subtotalCents, taxRateBp: totals.taxRateBp, taxCents: totals.taxCents, totalCents: totals.totalCents,
          depositCents: totals.depositCents, validUntil: null, sentAt: null, acceptedAt: null,
        },
        { transaction: t },
      );
      await writeLines(quote.id, lines, t);
      const record = (await getQuote(quote.id, t))!;
      await recordAudit({ user, action: 'quote.created', entityType: 'quote', entityId: quote.id, before: null, after: { number: record.number, totalCents: record.totalCents } }, t);
      await auditAuthority(extra.verdict, settings.maxCounterDiscountBp, user, quote.id, t);
      return { record };
    }, { uniqueFields: { number: 'number' } }));
    // Two creators racing for the same number: the loser tries again with the next one.
    const numberClash = !outcome.ok && outcome.reason === 'invalid' && outcome.errors.some((e) => e.field === 'number');
    if (!numberClash || attempt >= 3) return outcome;
  }
}

export type QuotePatch = { version: number; lines?: QuoteLineInput[]; validUntil?: string | null };

/** Lines (replaced as a whole) and the validity date, while the quote is a draft; totals follow. */
export async function updateQuote(id: number, patch: QuotePatch, user: SessionUser): Promise<QuoteWriteOutcome> {
  db();
  return withPriceAuthority(() => runWrite(
    async (t) => {
      const quote = await Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!quote) throw notFound();
      if (quote.version !== patch.version) throw conflict(await getQuote(id, t));
      // Lines change only on a draft (a sent quote is revised instead); the valid-until day may be moved
      // while the customer can still act on the quote.
      if (patch.lines && quote.status !== 'draft') throw refused(`Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; only a draft's lines can be changed. Revise it for new lines.`);
      if (!['draft', 'sent', 'accepted'].includes(quote.status)) throw refused(`Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()} and can no longer be changed.`);
      if (patch.validUntil !== undefined && quote.status !== 'draft' && (patch.validUntil === null || patch.validUntil < new Date().toISOString().slice(0, 10))) {
        throw invalid([{ field: 'validUntil', message: 'a sent quote needs a valid-until day of today or later' }]);
      }
      const before = await getQuote(id, t);
      const settings = await shopSettings(t);
      if (patch.lines) {
        // A price already on the quote (a manager's, or last month's catalogue price) may stay as it is.
        const kept = new Map<string, number>();
        for (const l of before?.lines ?? []) {
          const key = catalogueKey(l);
          if (key) kept.set(key, l.unitPriceCents);
        }
        const { lines, verdict } = await resolveLines(patch.lines, { field: 'lines', laborRateCents: settings.laborRateCents, maxCounterDiscountBp: settings.maxCounterDiscountBp, user, kept }, t);
        await writeLines(id, lines, t);
        await auditAuthority(verdict, settings.maxCounterDiscountBp, user, id, t);
        const totals = quoteTotals(lines, quote.taxRateBp, policyOf(settings));
        quote.set({ subtotalCents: totals.subtotalCents, taxCents: totals.taxCents, totalCents: totals.totalCents, depositCents: totals.depositCents });
        quote.changed('updatedAt', true);
      }
      if (patch.validUntil !== undefined) quote.set({ validUntil: patch.validUntil });
      if (!quote.changed()) return { record: before!, changed: false };
      await quote.save({ transaction: t });
      const after = (await getQuote(id, t))!;
      await recordAudit({ user, action: 'quote.updated', entityType: 'quote', entityId: id, before: { totalCents: before?.totalCents, validUntil: before?.validUntil }, after: { totalCents: after.totalCents, validUntil: after.validUntil } }, t);
      return { record: after };
    },
    { reload: () => getQuote(id) },
  ));
}

// ---- Sending and the customer's link ----

export const sha256 = (text: string) => crypto.createHash('sha256').update(text).digest('hex');

/** 32 random bytes, base64url: 43 characters, 256 bits — not guessable, safe in a URL. */
export function newQuoteToken(): string {
  return crypto.randomBytes(32).toString('base64url');
}

/**
 * Sends (or sends again) the quote: a fresh private token whose sha256 alone is stored, an e-mail with
 * the link, status → sent (through the lifecycle). The mail goes out inside the transaction, so a refused
 * mail changes nothing; sending again replaces the token, and the old link stops working. The first send
 * sets a missing valid-until day and freezes the build profile and the advisor's result for the cam.
 */
export async function sendQuote(id: number, user: SessionUser): Promise<WriteOutcome<QuoteRecord> | { ok: false; reason: 'mail-failed'; message: string }> {
  db();
  const peek = await Quote.findByPk(id, { attributes: ['id', 'buildId', 'camId', 'snapshotProfile'] });
  const snapshot = peek && readJson(peek.snapshotProfile) === null ? await takeSnapshot(peek.buildId, peek.camId) : null;
  try {
    return await runWrite(async (t) => {
      const quote = (await Quote.findByPk(id, { include: include(), transaction: t, lock: t.LOCK.UPDATE })) as QuoteRow | null;
      if (!quote) throw notFound();
      const email = quote.customer?.email;
      if (quote.status === 'draft' || quote.status === 'sent') {
        if (!email) throw invalid([{ field: 'customer.email', message: 'the customer has no e-mail address; add one before sending' }]);
        if (!(quote.lines ?? []).length) throw invalid([{ field: 'lines', message: 'the quote has no lines' }]);
      }
      const token = newQuoteToken();
      const now = new Date();
      quote.set({ publicTokenHash: sha256(token), sentAt: now, validUntil: quote.validUntil ?? validUntilFrom(now) });
      if (snapshot && readJson(quote.snapshotProfile) === null) quote.set({ snapshotProfile: snapshot.profile as Record<string, unknown>, snapshotAdvice: snapshot.advice });
      try {
        await moveQuote(quote, 'sent', 'send', { user }, t, { to: email });
      } catch (error) {
        if (error instanceof LifecycleRefused) throw refused(`Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; only a draft or a sent quote can be sent.`);
        throw error;
      }
      const settings = await shopSettings(t);
      const record = (await getQuote(id, t))!;
      await recordAudit({ user, action: 'quote.sent', entityType: 'quote', entityId: id, before: null, after: { to: email, revision: record.revision } }, t);
      await sendMail(await quoteSentMail(record, mailShop(settings), `${appBaseUrl()}/q/${token}`, record.revisionOf?.number ?? null));
      return { record };
    });
  } catch (error) {
    if (error instanceof Error && /Mail was not accepted|fetch failed|ECONNREFUSED/.test(error.message)) {
      return { ok: false, reason: 'mail-failed', message: 'The e-mail could not be sent, so the quote was not marked as sent. Try again in a moment.' };
    }
    throw error;
  }
}

export type PublicQuote = {
  quote: QuoteRecord;
  shop: { name: string; phone: string; email: string; address: string; depositPolicyText: string; currency: string };
};

/** The shop's details printed on documents; null until a manager has saved the settings. */
export async function shopForDocuments(): Promise<PublicQuote['shop'] | null> {
  db();
  const s = await ShopSettings.findOne({ order: [['id', 'ASC']] });
  return s ? { name: s.name, phone: s.phone, email: s.email, address: s.address, depositPolicyText: s.depositPolicyText, currency: s.currency } : null;
}

/** The quote a private link opens, or null for any token that is not a live link (never a hint why). */
export async function getQuoteByToken(token: string): Promise<PublicQuote | null> {
  if (!/^[A-Za-z0-9_-]{20,128}$/.test(token)) return null;
  db();
  // The link e-mailed with the quote, or one e-mailed later (the balance request, the expiry reminder).
  const hash = sha256(token);
  const row = await Quote.findOne({ where: { publicTokenHash: hash }, attributes: ['id'] });
  const quoteId = row?.id ?? (await quoteIdByLinkHash(hash));
  if (!quoteId) return null;
  const [quote, settings] = await Promise.all([getQuote(quoteId), ShopSettings.findOne({ order: [['id', 'ASC']] })]);
  if (!quote || !settings || quote.status === 'draft') return null;
  const { costCents: _c, marginCents: _m, ...rest } = quote;
  void _c;
  void _m;
  return {
    // The customer sees the money that was taken (for their receipts), never provider ids or who took it.
    quote: { ...rest, lines: rest.lines.map(({ unitCostCents: _u, ...l }) => (void _u, l)), payments: rest.payments.filter(counts).map(customerPayment) },
    shop: { name: settings.name, phone: settings.phone, email: settings.email, address: settings.address, depositPolicyText: settings.depositPolicyText, currency: settings.currency },
  };
}

function customerPayment(p: PaymentRecord): PaymentRecord {
  return { ...p, providerSessionId: null, providerPaymentId: null, recordedBy: null };
}

function refundState(amountCents: number, refundedCents: number): Payment['status'] {
  return refundedCents >= amountCents ? 'refunded' : 'partially-refunded';
}

export type RefundOutcome = { ok: true; record: QuoteRecord } | { ok: false; status: 404 | 409 | 422 | 502; message: string; errors?: FieldError[] };

/**
 * A manager refunds part or all of the paid deposit through the payments SDK; never more than is left.
 * A full refund cancels the job (or reopens the quote, as the manager chooses) and e-mails the customer.
 */
export async function refundQuote(id: number, amountCents: number, reason: string | undefined, user: SessionUser, afterFullRefund: AfterFullRefund = 'cancel'): Promise<RefundOutcome> {
  db();
  let settled = false;
  const result = await db().transaction(async (t): Promise<RefundOutcome | null> => {
    // The quote row first, then its payments: the order every deposit path locks in (see deposits.ts).
    const quote = await Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!quote) return { ok: false, status: 404, message: `No quote with id ${id}.` };
    const payment = await Payment.findOne({
      // The deposit: balance payments are settled at the counter or by the provider's dashboard for now.
      where: { quoteId: id, purpose: 'deposit', status: { [Op.in]: ['paid', 'partially-refunded'] }, duplicateOfPaymentId: null },
      order: [['id', 'DESC']],
      transaction: t,
      lock: t.LOCK.UPDATE,
    });
    if (!payment || !payment.providerPaymentId) return { ok: false, status: 409, message: `Quote ${quote.number} has no paid deposit to refund.` };
    const left = payment.amountCents - payment.refundedCents;
    if (amountCents > left) {
      return { ok: false, status: 422, message: 'Some fields need attention.', errors: [{ field: 'amountCents', message: `at most ${left} cents can be refunded (paid ${payment.amountCents}, already refunded ${payment.refundedCents})` }] };
    }
    try {
      await payments().refunds.create(
        { payment_intent: payment.providerPaymentId, amount: amountCents, metadata: { quoteId: String(id), byUser: String(user.id), ...(reason ? { note: reason.slice(0, 200) } : {}) } },
        { idempotencyKey: `refund-${payment.id}-${payment.refundedCents}-${amountCents}` },
      );
    } catch (error) {
      const message = error instanceof Error ? error.message : 'no answer';
      return { ok: false, status: 502, message: `The payment service refused the refund: ${message}. Nothing was changed.` };
    }
    // The webhook may have landed first; both sides take the larger running total, so it is counted once.
    await payment.reload({ transaction: t, lock: t.LOCK.UPDATE });
    const refunded = Math.min(payment.amountCents, Math.max(payment.refundedCents, payment.amountCents - left + amountCents));
    payment.set({ refundedCents: refunded, status: refundState(payment.amountCents, refunded) });
    await payment.save({ transaction: t });
    await recordAudit({ user, action: 'payment.refund-requested', entityType: 'quote', entityId: id, after: { paymentId: payment.id, amountCents, reason: reason ?? null } }, t);
    settled = payment.status === 'refunded' && (await settleFullRefund(quote, afterFullRefund, { user }, t));
    return null;
  });
  if (result) return result;
  if (settled) await sendRefundNotice(id);
  return { ok: true, record: (await getQuote(id))! };
}

export type { QuoteStatus };
