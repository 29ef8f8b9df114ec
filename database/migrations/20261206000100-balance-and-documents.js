'use strict';

// The balance, its documents and the expiry reminder (issue 12, items 5-7).
// - payments.purpose: 'deposit' (the checkout that books the job) or 'balance' (the rest, when the job
//   is done). Every earlier row is a deposit, which is what the default makes of it.
// - payments.method: 'online' (through the payments SDK) or 'cash' / 'card-present' (taken at the
//   counter); payments.recorded_by_user_id says who took a counter payment.
// - quote_links: extra private links to a quote's customer page (the pay-the-balance e-mail, the expiry
//   reminder). Only the SHA-256 of each token is kept, like quotes.public_token_hash, so a link that was
//   e-mailed can never be e-mailed again: a new e-mail gets a new token.
// - quotes.balance_requested_at: when staff last e-mailed the pay-the-balance link.
// - quotes.expiry_reminded_at: set in the same transaction that e-mails the reminder, so a second run of
//   the reminder command never writes to the same customer twice.
// - payments_paid_at_purpose_cover replaces payments_paid_at_cover: the report sums deposits and
//   balances separately over a paid_at range without reading the rows.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('payments', 'purpose', { type: S.ENUM('deposit', 'balance'), allowNull: false, defaultValue: 'deposit' });
    await q.addColumn('payments', 'method', { type: S.ENUM('online', 'cash', 'card-present'), allowNull: false, defaultValue: 'online' });
    await q.addColumn('payments', 'recorded_by_user_id', {
      type: S.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'SET NULL',
    });
    await q.addColumn('quotes', 'balance_requested_at', { type: S.DATE, allowNull: true });
    await q.addColumn('quotes', 'expiry_reminded_at', { type: S.DATE, allowNull: true });
    await q.createTable('quote_links', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      quote_id: { type: S.INTEGER.UNSIGNED, allowNull: false, references: { model: 'quotes', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'CASCADE' },
      token_hash: { type: S.CHAR(64), allowNull: false, unique: true },
      purpose: { type: S.ENUM('balance', 'reminder'), allowNull: false },
      created_at: { type: S.DATE, allowNull: false },
      updated_at: { type: S.DATE, allowNull: false },
    });
    await q.addIndex('quote_links', ['quote_id']);
    await q.addIndex('payments', ['paid_at', 'purpose', 'status', 'amount_cents', 'refunded_cents'], { name: 'payments_paid_at_purpose_cover' });
    await q.removeIndex('payments', 'payments_paid_at_cover');
  },

  async down(q) {
    await q.addIndex('payments', ['paid_at', 'status', 'amount_cents', 'refunded_cents'], { name: 'payments_paid_at_cover' });
    await q.removeIndex('payments', 'payments_paid_at_purpose_cover');
    await q.dropTable('quote_links');
    await q.removeColumn('quotes', 'expiry_reminded_at');
    await q.removeColumn('quotes', 'balance_requested_at');
    // MariaDB keeps the foreign key's constraint until it is dropped by name.
    const [rows] = await q.sequelize.query(
      "SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'payments' AND COLUMN_NAME = 'recorded_by_user_id' AND REFERENCED_TABLE_NAME IS NOT NULL",
    );
    for (const row of rows) await q.removeConstraint('payments', row.name);
    await q.removeColumn('payments', 'recorded_by_user_id');
    await q.removeColumn('payments', 'method');
    await q.removeColumn('payments', 'purpose');
  },
};
