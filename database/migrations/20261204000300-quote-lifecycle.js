'use strict';

// The quote lifecycle (issue 12, item 2).
// - quotes.status gains 'closed' (balance paid, job done) and 'replaced' (a newer revision took over;
//   the old customer link still opens and says so).
// - revision / revision_of_quote_id / replaced_by_quote_id: a revised quote is a new row numbered
//   Q-YYYY-NNNN-R2, R3, ...; each points at the one it replaces and is pointed at in turn.
// - snapshot_profile / snapshot_advice: the build profile and the advisor's result for the quoted cam,
//   frozen when the quote is first sent, so a later edit of the build never changes a sent quote.
// - closed_at: when the balance was recorded as paid.

const WITH = ['draft', 'sent', 'accepted', 'deposit-paid', 'closed', 'declined', 'expired', 'cancelled', 'replaced'];
const WITHOUT = ['draft', 'sent', 'accepted', 'deposit-paid', 'declined', 'expired', 'cancelled'];

const selfRef = (S) => ({ type: S.INTEGER.UNSIGNED, allowNull: true, references: { model: 'quotes', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'SET NULL' });

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.changeColumn('quotes', 'status', { type: S.ENUM(...WITH), allowNull: false, defaultValue: 'draft' });
    await q.addColumn('quotes', 'revision', { type: S.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 });
    await q.addColumn('quotes', 'revision_of_quote_id', selfRef(S));
    await q.addColumn('quotes', 'replaced_by_quote_id', selfRef(S));
    await q.addColumn('quotes', 'snapshot_profile', { type: S.JSON, allowNull: true });
    await q.addColumn('quotes', 'snapshot_advice', { type: S.JSON, allowNull: true });
    await q.addColumn('quotes', 'closed_at', { type: S.DATE, allowNull: true });
  },

  async down(q, S) {
    // The older enum has no word for these; the nearest honest one is cancelled (no longer open).
    await q.sequelize.query("UPDATE quotes SET status = 'cancelled' WHERE status IN ('closed', 'replaced')");
    await q.changeColumn('quotes', 'status', { type: S.ENUM(...WITHOUT), allowNull: false, defaultValue: 'draft' });
    const [rows] = await q.sequelize.query(
      "SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'quotes' AND COLUMN_NAME IN ('revision_of_quote_id', 'replaced_by_quote_id') AND REFERENCED_TABLE_NAME IS NOT NULL",
    );
    for (const row of rows) await q.removeConstraint('quotes', row.name);
    for (const column of ['closed_at', 'snapshot_advice', 'snapshot_profile', 'replaced_by_quote_id', 'revision_of_quote_id', 'revision']) {
      await q.removeColumn('quotes', column);
    }
  },
};
