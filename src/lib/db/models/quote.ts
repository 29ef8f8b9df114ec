import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

import { DISCOUNT_APPROVAL_STATES, type DiscountApprovalState } from '@/lib/quotes/discount-approval';
import { QUOTE_STATE_LIST, type QuoteStatus } from '@/lib/quotes/lifecycle';

// The states, their words and the legal moves between them live in src/lib/quotes/lifecycle.ts.
export const QUOTE_STATUSES = QUOTE_STATE_LIST;
export type { QuoteStatus };

export class Quote extends Model<InferAttributes<Quote>, InferCreationAttributes<Quote>> {
  declare id: CreationOptional<number>;
  declare number: string;
  declare customerId: ForeignKey<number>;
  declare buildId: ForeignKey<number> | null;
  declare camId: ForeignKey<number> | null;
  declare createdByUserId: ForeignKey<number> | null;
  declare status: CreationOptional<QuoteStatus>;
  declare publicTokenHash: string | null;
  declare subtotalCents: number;
  declare taxRateBp: number;
  declare taxCents: number;
  declare totalCents: number;
  declare depositCents: number;
  declare validUntil: string | null;
  declare sentAt: Date | null;
  declare acceptedAt: Date | null;
  declare closedAt: CreationOptional<Date | null>;
  /** When staff last e-mailed the pay-the-balance link; the customer's page offers the balance from then on. */
  declare balanceRequestedAt: CreationOptional<Date | null>;
  /** When the expiry reminder was e-mailed; set once, so the reminder never goes twice. */
  declare expiryRemindedAt: CreationOptional<Date | null>;
  /** 1 for the first quote; a revision is numbered with -R<revision>. */
  declare revision: CreationOptional<number>;
  declare revisionOfQuoteId: CreationOptional<number | null>;
  declare replacedByQuoteId: CreationOptional<number | null>;
  /** Frozen at the first send: the build profile and the advisor's result the customer was shown. */
  declare snapshotProfile: CreationOptional<Record<string, unknown> | null>;
  declare snapshotAdvice: CreationOptional<Record<string, unknown> | null>;
  /** A counter discount above the shop's limit waits for a manager ('pending'); see src/lib/quotes/discount-approval.ts. */
  declare discountApproval: CreationOptional<DiscountApprovalState>;
  declare discountApprovedByUserId: CreationOptional<ForeignKey<number> | null>;
  declare discountApprovedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // Fresh objects per attribute: Sequelize writes the column name into each definition it is given.
    const cents = () => ({ type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
    Quote.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
        status: { type: DataTypes.ENUM(...QUOTE_STATUSES), allowNull: false, defaultValue: 'draft' },
        publicTokenHash: { type: DataTypes.CHAR(64), allowNull: true, unique: true },
        subtotalCents: cents(),
        taxRateBp: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        taxCents: cents(),
        totalCents: cents(),
        depositCents: cents(),
        validUntil: { type: DataTypes.DATEONLY, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        balanceRequestedAt: { type: DataTypes.DATE, allowNull: true },
        expiryRemindedAt: { type: DataTypes.DATE, allowNull: true },
        revision: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        revisionOfQuoteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        replacedByQuoteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        snapshotProfile: { type: DataTypes.JSON, allowNull: true },
        snapshotAdvice: { type: DataTypes.JSON, allowNull: true },
        discountApproval: {
          type: DataTypes.ENUM(...DISCOUNT_APPROVAL_STATES),
          allowNull: false,
          defaultValue: 'none',
        },
        discountApprovedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        discountApprovedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Quote', tableName: 'quotes', underscored: true, version: true },
    );
  }
}

export const QUOTE_LINE_KINDS = ['cam', 'part', 'labor', 'tune', 'other'] as const;

export class QuoteLine extends Model<InferAttributes<QuoteLine>, InferCreationAttributes<QuoteLine>> {
  declare id: CreationOptional<number>;
  declare quoteId: ForeignKey<number>;
  declare kind: (typeof QUOTE_LINE_KINDS)[number];
  declare camId: ForeignKey<number> | null;
  declare partId: ForeignKey<number> | null;
  declare laborOperationId: ForeignKey<number> | null;
  declare description: string;
  declare quantity: string | number;
  declare unitPriceCents: number;
  declare totalCents: number;
  /** Taken off this line before tax; see src/lib/quotes/authority.ts for who may give how much. */
  declare discountCents: CreationOptional<number>;
  declare sortOrder: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    QuoteLine.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.ENUM(...QUOTE_LINE_KINDS), allowNull: false },
        // Declared here (no association maps them): without these Sequelize drops the catalogue links on write and read.
        camId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        partId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        laborOperationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        description: { type: DataTypes.STRING(255), allowNull: false },
        quantity: { type: DataTypes.DECIMAL(8, 2), allowNull: false, defaultValue: 1 },
        unitPriceCents: { type: DataTypes.INTEGER, allowNull: false },
        totalCents: { type: DataTypes.INTEGER, allowNull: false },
        discountCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        sortOrder: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'QuoteLine', tableName: 'quote_lines', underscored: true },
    );
  }
}

export const PAYMENT_STATUSES = ['pending', 'paid', 'failed', 'expired', 'refunded', 'partially-refunded'] as const;
/** 'deposit' books the job; 'balance' is the rest, paid when the job is done. */
export const PAYMENT_PURPOSES = ['deposit', 'balance'] as const;
/** 'online' went through the payments SDK; 'cash' and 'card-present' were taken at the counter. */
export const PAYMENT_METHODS = ['online', 'cash', 'card-present'] as const;
export type PaymentPurpose = (typeof PAYMENT_PURPOSES)[number];
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<number>;
  declare quoteId: ForeignKey<number>;
  declare provider: CreationOptional<string>;
  declare providerSessionId: string | null;
  declare providerPaymentId: string | null;
  declare amountCents: number;
  declare refundedCents: CreationOptional<number>;
  declare currency: CreationOptional<string>;
  declare status: CreationOptional<(typeof PAYMENT_STATUSES)[number]>;
  declare paidAt: Date | null;
  /** Set on a second paid checkout for a quote already paid: it was refunded and is never counted. */
  declare duplicateOfPaymentId: CreationOptional<number | null>;
  declare purpose: CreationOptional<PaymentPurpose>;
  declare method: CreationOptional<PaymentMethod>;
  /** Who took a counter payment; null for online payments. */
  declare recordedByUserId: CreationOptional<ForeignKey<number> | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Payment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        provider: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'stripe' },
        providerSessionId: { type: DataTypes.STRING(255), allowNull: true, unique: true },
        providerPaymentId: { type: DataTypes.STRING(255), allowNull: true },
        amountCents: { type: DataTypes.INTEGER, allowNull: false },
        refundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'usd' },
        status: { type: DataTypes.ENUM(...PAYMENT_STATUSES), allowNull: false, defaultValue: 'pending' },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        duplicateOfPaymentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        purpose: { type: DataTypes.ENUM(...PAYMENT_PURPOSES), allowNull: false, defaultValue: 'deposit' },
        method: { type: DataTypes.ENUM(...PAYMENT_METHODS), allowNull: false, defaultValue: 'online' },
        recordedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Payment', tableName: 'payments', underscored: true },
    );
  }
}
