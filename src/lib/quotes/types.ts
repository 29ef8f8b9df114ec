import type { Payment } from '@/lib/db/models';
import type { PaymentMethod, PaymentPurpose } from './balance';
import type { DiscountApproval } from './discount-approval';
import type { QuoteLineKind } from './pricing';
import type { QuoteStatus } from './lifecycle';

// The shapes a quote is read in: by the API (JSON), the staff and customer pages, the PDFs and the
// e-mails. The query layer (src/lib/db/queries/quotes.ts) builds them; nothing here touches the database.

export type { QuoteStatus };

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

/** What a sent quote was based on, frozen at its first send: the build profile and the advisor's result. */
export type QuoteSnapshot = { profile: unknown; advice: Record<string, unknown> | null };

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
  /** A counter discount above the shop's limit waits for a manager before the quote can be sent. */
  discountApproval: DiscountApproval;
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
  /** Goods cost and margin; left out for roles without 'costs.read' (see presentQuote in src/lib/quotes/present.ts). */
  costCents?: number;
  marginCents?: number;
  version: number;
  createdAt: string;
  updatedAt: string;
};

/** The shop's details printed on documents and the customer's page. */
export type DocumentShop = {
  name: string;
  phone: string;
  email: string;
  address: string;
  depositPolicyText: string;
  currency: string;
};

export type PublicQuote = { quote: QuoteRecord; shop: DocumentShop };

/** What the customer's page and a refused checkout say about where the quote stands. */
export type CheckoutState = {
  status: QuoteStatus;
  depositPaid: boolean;
  validUntil: string | null;
  expired: boolean;
  paymentConfirming: boolean;
};

/** A checkout the customer can go to: a new payment page, or the open one handed out again. */
export type CheckoutStarted = { url: string; reused: boolean };

/** What a payment event did (the webhook answers it as is); each effect is idempotent. */
export type WebhookResult =
  | { result: 'applied' | 'already' | 'ignored' }
  | { result: 'refused'; reason: string }
  | { result: 'refunded-duplicate'; duplicateOfPaymentId: number }
  | { result: 'refunded-closed-quote' };

/** Where a quote stands, answered with a refused move: the state, its word and what staff may do from there. */
export type LifecycleState = {
  status: QuoteStatus;
  word: string;
  allowed: QuoteStatus[];
  validUntil: string | null;
  expired: boolean;
  replacedBy: number | null;
};

/** After a full refund of the deposit: the job is cancelled (the default) or the quote reopened for a new payment. */
export type AfterFullRefund = 'cancel' | 'reopen';
