'use strict';

// Exactly-once deposits and price authority (issue 12, items 3 and 8).
// - payments.duplicate_of_payment_id: a second paid checkout for a quote whose deposit was already
//   paid is refunded automatically and points at the payment it duplicates, so it is never counted.
// - quote_lines.discount_cents: a discount on one line, in cents, taken off before tax.
// - shop_settings.max_counter_discount_bp: the largest discount, as a share of the job before tax,
//   counter staff may give without a manager (basis points; 500 = 5 %).

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('payments', 'duplicate_of_payment_id', {
      type: S.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'payments', key: 'id' },
      onUpdate: 'CASCADE',
      onDelete: 'SET NULL',
    });
    await q.addColumn('quote_lines', 'discount_cents', { type: S.INTEGER, allowNull: false, defaultValue: 0 });
    await q.addColumn('shop_settings', 'max_counter_discount_bp', { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 500 });
  },

  async down(q) {
    await q.removeColumn('shop_settings', 'max_counter_discount_bp');
    await q.removeColumn('quote_lines', 'discount_cents');
    // MariaDB keeps the foreign key's constraint until it is dropped by name.
    const [rows] = await q.sequelize.query(
      "SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'payments' AND COLUMN_NAME = 'duplicate_of_payment_id' AND REFERENCED_TABLE_NAME IS NOT NULL",
    );
    for (const row of rows) await q.removeConstraint('payments', row.name);
    await q.removeColumn('payments', 'duplicate_of_payment_id');
  },
};
