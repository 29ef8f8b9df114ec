'use strict';

// The report's goods margin reads the cam and part lines of a year's deposit-paid quotes. Through the
// plain quote_id index every line cost a primary-key lookup: ~75,000 random reads at 200,000 quotes
// (1.1 s). This index holds every column the margin reads, so the lines come off it in quote order.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q) {
    await q.addIndex('quote_lines', ['quote_id', 'kind', 'cam_id', 'part_id', 'quantity', 'total_cents'], { name: 'quote_lines_report_cover' });
  },

  async down(q) {
    // InnoDB drops the index it made for the quote_id foreign key once this one can serve the key, and
    // then refuses to drop this one: give the key its own index back first (unless it is still there).
    const [rows] = await q.sequelize.query("SHOW INDEX FROM quote_lines WHERE Seq_in_index = 1 AND Column_name = 'quote_id'");
    if (!rows.some((r) => r.Key_name !== 'quote_lines_report_cover')) await q.addIndex('quote_lines', ['quote_id'], { name: 'quote_id' });
    await q.removeIndex('quote_lines', 'quote_lines_report_cover');
  },
};
