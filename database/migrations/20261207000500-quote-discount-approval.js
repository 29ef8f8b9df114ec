'use strict';

// A manager's approval of a counter discount above the shop's limit (issue 12, item 8).
// - quotes.discount_approval: 'none' (the discounts are within the counter limit), 'pending' (counter staff
//   saved more than the limit: the quote waits for a manager and cannot be sent) or 'approved' (a manager
//   approved it, or gave it themselves). Every earlier quote was saved under the old rule, which refused
//   such a discount outright, so 'none' is what the default makes of it.
// - quotes.discount_approved_by_user_id and discount_approved_at: who approved and when (null unless
//   approved); kept when the approver's account goes, like payments.recorded_by_user_id.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('quotes', 'discount_approval', { type: S.ENUM('none', 'pending', 'approved'), allowNull: false, defaultValue: 'none' });
    await q.addColumn('quotes', 'discount_approved_by_user_id', {
      type: S.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'SET NULL',
    });
    await q.addColumn('quotes', 'discount_approved_at', { type: S.DATE, allowNull: true });
  },

  async down(q) {
    await q.removeColumn('quotes', 'discount_approved_at');
    // MariaDB keeps the foreign key's constraint until it is dropped by name.
    const [rows] = await q.sequelize.query(
      "SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'quotes' AND COLUMN_NAME = 'discount_approved_by_user_id' AND REFERENCED_TABLE_NAME IS NOT NULL",
    );
    for (const row of rows) await q.removeConstraint('quotes', row.name);
    await q.removeColumn('quotes', 'discount_approved_by_user_id');
    await q.removeColumn('quotes', 'discount_approval');
  },
};
