'use strict';

// Indexes for the lists, searches and reports (issue 11, item 2). Without them every list sorted the
// whole table (quotes by updated_at, leads by created_at, builds by updated_at), the reports read quotes
// on created_at alone, and customer search could only scan with LIKE '%q%'.
// tests/integration/explain-plans.test.ts fails when a list or report query loses its index again.

const INDEXES = [
  // Lists: newest change first with an id tie-break, also within one status.
  ['quotes', ['updated_at', 'id'], 'quotes_updated_at_id'],
  ['quotes', ['status', 'updated_at', 'id'], 'quotes_status_updated_at_id'],
  ['leads', ['created_at', 'id'], 'leads_created_at_id'],
  ['builds', ['updated_at', 'id'], 'builds_updated_at_id'],
  ['customers', ['name', 'id'], 'customers_name_id'],
  ['customers', ['updated_at', 'id'], 'customers_updated_at_id'],
  // Short customer searches (under the full-text minimum of 3 characters) are prefix searches on these.
  ['customers', ['phone'], 'customers_phone'],
  // The CSV export walks a range in (created_at, id) order, a chunk at a time.
  ['quotes', ['created_at', 'id'], 'quotes_created_at_id'],
  // Covering the report's quote figures: counts and values by status, sent conversion, most-quoted cams
  // all read only these columns over a created_at range, so they never touch the rows themselves.
  ['quotes', ['created_at', 'status', 'cam_id', 'sent_at', 'total_cents'], 'quotes_report_cover'],
  // Deposits taken in a range (paid_at), covering the sums.
  ['payments', ['paid_at', 'status', 'amount_cents', 'refunded_cents'], 'payments_paid_at_cover'],
];

// Full-text indexes for customer and vehicle search. Built without the stopword list: customers are
// called Will, May or Love, and "will" is an InnoDB stopword that would make them unfindable.
const FULLTEXT = [
  ['customers', ['name', 'email', 'phone'], 'customers_search'],
  ['builds', ['vehicle_label'], 'builds_vehicle_search'],
];

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q) {
    for (const [table, fields, name] of INDEXES) await q.addIndex(table, fields, { name });
    for (const [table, fields, name] of FULLTEXT) {
      const columns = fields.map((f) => `\`${f}\``).join(', ');
      await q.sequelize.query(`SET STATEMENT innodb_ft_enable_stopword = OFF FOR ALTER TABLE \`${table}\` ADD FULLTEXT INDEX \`${name}\` (${columns})`);
    }
  },

  async down(q) {
    for (const [table, , name] of [...FULLTEXT].reverse()) await q.removeIndex(table, name);
    for (const [table, , name] of [...INDEXES].reverse()) await q.removeIndex(table, name);
  },
};
