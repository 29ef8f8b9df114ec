'use strict';

// Issue 11, item 6 (targets at size L):
// - The quote list's total was an exact COUNT(*) over 200,000 index entries on every page (~40-100 ms).
//   quote_status_counts holds the number of quotes in each state, kept by triggers in the same statement
//   as the insert, update or delete, so the unfiltered and by-state totals are a read of eight rows.
//   The two rows of a change of state are always taken in one order, so two opposite changes cannot deadlock.
// - The CSV export names each quote's customer and vehicle: through the primary keys every row cost a
//   lookup into the builds' pages full of profile JSON. These two indexes hold just the id and the name.

const TRIGGERS = {
  quotes_count_insert: `CREATE TRIGGER quotes_count_insert AFTER INSERT ON quotes FOR EACH ROW
    INSERT INTO quote_status_counts (status, quotes) VALUES (NEW.status, 1) ON DUPLICATE KEY UPDATE quotes = quotes + 1`,
  quotes_count_delete: `CREATE TRIGGER quotes_count_delete AFTER DELETE ON quotes FOR EACH ROW
    UPDATE quote_status_counts SET quotes = quotes - 1 WHERE status = OLD.status`,
  quotes_count_update: `CREATE TRIGGER quotes_count_update AFTER UPDATE ON quotes FOR EACH ROW
    BEGIN
      IF NEW.status <> OLD.status THEN
        IF OLD.status < NEW.status THEN
          UPDATE quote_status_counts SET quotes = quotes - 1 WHERE status = OLD.status;
          INSERT INTO quote_status_counts (status, quotes) VALUES (NEW.status, 1) ON DUPLICATE KEY UPDATE quotes = quotes + 1;
        ELSE
          INSERT INTO quote_status_counts (status, quotes) VALUES (NEW.status, 1) ON DUPLICATE KEY UPDATE quotes = quotes + 1;
          UPDATE quote_status_counts SET quotes = quotes - 1 WHERE status = OLD.status;
        END IF;
      END IF;
    END`,
};

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('quote_status_counts', {
      status: { type: S.STRING(32), allowNull: false, primaryKey: true },
      quotes: { type: S.INTEGER, allowNull: false, defaultValue: 0 },
    });
    // Triggers first, then the counts as they stand (a quote written in between is in both; the count wins).
    for (const sql of Object.values(TRIGGERS)) await q.sequelize.query(sql);
    await q.sequelize.query(
      'INSERT INTO quote_status_counts (status, quotes) SELECT status, COUNT(*) FROM quotes GROUP BY status ON DUPLICATE KEY UPDATE quotes = VALUES(quotes)',
    );
    await q.addIndex('builds', ['id', 'vehicle_label'], { unique: true, name: 'builds_id_label' });
    await q.addIndex('customers', ['id', 'name'], { unique: true, name: 'customers_id_name' });
  },

  async down(q) {
    await q.removeIndex('customers', 'customers_id_name');
    await q.removeIndex('builds', 'builds_id_label');
    for (const name of Object.keys(TRIGGERS).reverse()) await q.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
    await q.dropTable('quote_status_counts');
  },
};
