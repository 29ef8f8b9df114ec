import 'server-only';
import { col, fn, Op, type Transaction } from 'sequelize';
import { hashToken } from '@/lib/auth/tokens';
import { discountShareBp } from '@/lib/quotes/authority';
import { balanceDueCents, moneyIn } from '@/lib/quotes/balance';
import type { DiscountApproval } from '@/lib/quotes/discount-approval';
import { stateWord } from '@/lib/quotes/lifecycle';
import { formatQuoteNumber, lineNetCents, lineTotalCents, nextQuoteSequence } from '@/lib/quotes/pricing';
import type { DocumentShop, PaymentRecord, QuoteLineRecord, QuoteRecord } from '@/lib/quotes/types';
import { Build, Cam, Customer, Part, Payment, Quote, QuoteLine, ShopSettings, User } from '../models';
import type { LineDraft } from './quote-lines';
import { quoteIdByLinkHash } from './quote-links';
import { readJson } from './quote-snapshot';

// Quotes in the database: reading one into a QuoteRecord (src/lib/quotes/types.ts), the rows the quote
// services in src/lib/quotes/ lock and write, and the customer's private link. SQL and mapping only:
// drafting, sending, checkout, payment events and refunds live in src/lib/quotes/.

type PaymentRow = Payment & { recordedBy?: User | null };
export type QuoteRow = Quote & {
  customer?: Customer;
  build?: Build | null;
  lines?: (QuoteLine & { cam?: Cam | null; part?: Part | null })[];
  payments?: PaymentRow[];
};

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

/** The discount's approval; the approver is read on its own so a locked read never locks a staff row. */
async function discountApproval(
  row: QuoteRow,
  lines: readonly QuoteLineRecord[],
  transaction?: Transaction,
): Promise<DiscountApproval> {
  const state = row.discountApproval ?? 'none';
  const approverId = state === 'approved' ? (row.discountApprovedByUserId ?? null) : null;
  const approver = approverId ? await User.findByPk(approverId, { attributes: ['id', 'name'], transaction }) : null;
  return {
    state,
    discountBp: discountShareBp(lines),
    approvedBy: approver ? { id: approver.id, name: approver.name } : null,
    approvedAt: state === 'approved' ? iso(row.discountApprovedAt) : null,
  };
}

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
    const unitCostCents =
      l.camId !== null ? (camCost.get(l.camId) ?? null) : l.partId !== null ? (partCost.get(l.partId) ?? null) : null;
    const quantity = Number(l.quantity);
    if (unitCostCents !== null) {
      costCents += lineTotalCents(quantity, unitCostCents);
      goodsCents += l.totalCents;
    }
    return {
      id: l.id,
      kind: l.kind,
      camId: l.camId ?? null,
      partId: l.partId ?? null,
      laborOperationId: l.laborOperationId ?? null,
      description: l.description,
      quantity,
      unitPriceCents: l.unitPriceCents,
      discountCents: l.discountCents ?? 0,
      totalCents: l.totalCents,
      sortOrder: l.sortOrder,
      unitCostCents,
    };
  });
  const pays = [...(row.payments ?? [])].sort((a, b) => a.id - b.id);
  // A refunded duplicate took the money and gave it back; the quote was paid once.
  const paid = pays.filter((p) => PAID_STATES.includes(p.status) && !p.duplicateOfPaymentId);
  const records = pays.map(paymentRecord);
  const money = moneyIn(records);
  const relatedIds = [row.revisionOfQuoteId, row.replacedByQuoteId].filter((v): v is number => typeof v === 'number');
  const related = relatedIds.length
    ? await Quote.findAll({ where: { id: relatedIds }, attributes: ['id', 'number', 'status', 'sentAt'], transaction })
    : [];
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
    snapshot:
      profile === null
        ? null
        : { profile, advice: (readJson(row.snapshotAdvice) as Record<string, unknown> | null) ?? null },
    closedAt: iso(row.closedAt),
    customer: {
      id: row.customer?.id ?? row.customerId,
      name: row.customer?.name ?? 'Unknown customer',
      email: row.customer?.email ?? null,
    },
    build: row.build ? { id: row.build.id, vehicleLabel: row.build.vehicleLabel } : null,
    camId: row.camId ?? null,
    lines: lineRecords,
    discountApproval: await discountApproval(row, lineRecords, transaction),
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

export async function getQuote(id: number, transaction?: Transaction): Promise<QuoteRecord | null> {
  const row = (await Quote.findByPk(id, { include: include(), transaction })) as QuoteRow | null;
  return row ? toQuoteRecord(row, transaction) : null;
}

// ---- Rows the quote services lock and write (always inside their transaction) ----

/** The quote row, locked for the rest of the transaction: every money path locks it before its payments. */
export function lockQuote(id: number, t: Transaction): Promise<Quote | null> {
  return Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
}

/** The quote row with its customer, lines and payments, locked (sending reads the e-mail and the lines). */
export async function lockQuoteWithParts(id: number, t: Transaction): Promise<QuoteRow | null> {
  return (await Quote.findByPk(id, { include: include(), transaction: t, lock: t.LOCK.UPDATE })) as QuoteRow | null;
}

/** The one row of shop settings (labour rate, tax, deposit policy, the shop's details); null before a manager saves them. */
export function shopSettingsRow(t?: Transaction): Promise<ShopSettings | null> {
  return ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t });
}

/** The build and cam a draft is made from (either may be missing). */
export async function draftSources(buildId: number, camId: number): Promise<{ build: Build | null; cam: Cam | null }> {
  const [build, cam] = await Promise.all([Build.findByPk(buildId), Cam.findByPk(camId)]);
  return { build, cam };
}

/** What sending needs to know before its transaction: the build and cam to freeze, and whether they already are. */
export async function snapshotSource(
  id: number,
): Promise<{ buildId: number | null; camId: number | null; frozen: boolean } | null> {
  const row = await Quote.findByPk(id, { attributes: ['id', 'buildId', 'camId', 'snapshotProfile'] });
  return row
    ? { buildId: row.buildId ?? null, camId: row.camId ?? null, frozen: readJson(row.snapshotProfile) !== null }
    : null;
}

/** Replaces a quote's lines as a whole, in the order given. */
export async function writeLines(quoteId: number, lines: LineDraft[], t: Transaction): Promise<void> {
  await QuoteLine.destroy({ where: { quoteId }, transaction: t });
  await QuoteLine.bulkCreate(
    lines.map((l, i) => ({
      ...l,
      quoteId,
      quantity: l.quantity.toFixed(2),
      totalCents: lineNetCents(l),
      sortOrder: i,
    })),
    { transaction: t },
  );
}

async function nextNumber(t: Transaction): Promise<string> {
  const year = new Date().getUTCFullYear();
  // The locking read serialises concurrent creators on the year's range; the unique index is the backstop.
  const last = await Quote.findOne({
    // Revisions (-R2, -R3) share their first quote's number and never advance the count.
    where: { number: { [Op.like]: `Q-${year}-%`, [Op.notLike]: '%-R%' } },
    order: [
      [fn('LENGTH', col('number')), 'DESC'],
      ['number', 'DESC'],
    ],
    attributes: ['id', 'number'],
    lock: t.LOCK.UPDATE,
    transaction: t,
  });
  return formatQuoteNumber(year, nextQuoteSequence(last?.number ?? null, year));
}

export type DraftRow = {
  customerId: number;
  buildId: number;
  camId: number;
  createdByUserId: number;
  totals: { subtotalCents: number; taxRateBp: number; taxCents: number; totalCents: number; depositCents: number };
  /** Where the draft's discount stands (src/lib/quotes/discount-approval.ts); 'none' when left out. */
  discount?: DiscountFields;
};

/** The quote's discount-approval columns, as the quote services set them. */
export type DiscountFields = Pick<Quote, 'discountApproval' | 'discountApprovedByUserId' | 'discountApprovedAt'>;

/** A new draft with the year's next number and its lines; returns its id. */
export async function insertDraft(draft: DraftRow, lines: LineDraft[], t: Transaction): Promise<number> {
  const { totals } = draft;
  const quote = await Quote.create(
    {
      number: await nextNumber(t),
      customerId: draft.customerId,
      buildId: draft.buildId,
      camId: draft.camId,
      createdByUserId: draft.createdByUserId,
      status: 'draft',
      publicTokenHash: null,
      subtotalCents: totals.subtotalCents,
      taxRateBp: totals.taxRateBp,
      taxCents: totals.taxCents,
      totalCents: totals.totalCents,
      depositCents: totals.depositCents,
      validUntil: null,
      sentAt: null,
      acceptedAt: null,
      ...(draft.discount ?? {}),
    },
    { transaction: t },
  );
  await writeLines(quote.id, lines, t);
  return quote.id;
}

/** The quote and customer a notice after the commit is about, with the payments that were not duplicates. */
export async function quoteForNotice(
  quoteId: number,
): Promise<{ quote: Quote | null; customer: Customer | undefined; payments: Payment[] }> {
  const quote = (await Quote.findByPk(quoteId, {
    include: [
      { model: Customer, as: 'customer', attributes: ['name', 'email'] },
      { model: Payment, as: 'payments' },
    ],
  })) as (Quote & { customer?: Customer; payments?: Payment[] }) | null;
  return { quote, customer: quote?.customer, payments: (quote?.payments ?? []).filter((p) => !p.duplicateOfPaymentId) };
}

// ---- The customer's link and the shop on documents ----

/** The shop's details printed on documents; null until a manager has saved the settings. */
export async function shopForDocuments(): Promise<DocumentShop | null> {
  const s = await ShopSettings.findOne({ order: [['id', 'ASC']] });
  return s
    ? {
        name: s.name,
        phone: s.phone,
        email: s.email,
        address: s.address,
        depositPolicyText: s.depositPolicyText,
        currency: s.currency,
      }
    : null;
}

/** The quote a private link opens (the one e-mailed with the quote, or a later one), or null for any other token. */
export async function quoteIdByToken(token: string): Promise<number | null> {
  if (!/^[A-Za-z0-9_-]{20,128}$/.test(token)) return null;
  // The link e-mailed with the quote, or one e-mailed later (the balance request, the expiry reminder).
  const hash = hashToken(token);
  const row = await Quote.findOne({ where: { publicTokenHash: hash }, attributes: ['id'] });
  return row?.id ?? (await quoteIdByLinkHash(hash));
}

export type { QuoteStatus } from '@/lib/quotes/types';
