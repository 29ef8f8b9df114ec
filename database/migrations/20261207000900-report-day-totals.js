'use strict';

// Issue 11, item 6: the one-year report summary at size L (200,000 quotes, 1.8 million lines) spent its
// time reading ~67,000 quotes for the counts by state and ~135,000 lines for the goods margin, on every
// request. Two tables keep those figures per day instead, written by triggers in the same statement (and
// so the same transaction) as the quote or line they come from:
// - report_quote_days: per creation day (UTC), state and whether the quote was ever sent, how many quotes
//   and their total. A year is a few thousand rows.
// - report_margin_days: per creation day of a converted quote (deposit paid, or closed), the sum of its cam
//   and part lines grouped the way the margin prices them (kind, cam, part, quantity): how many lines and
//   their revenue. The cost is not kept: the report prices lines at the catalogue's current cost.
//   cam_id / part_id are 0 where the line has none (a key column cannot be NULL; no catalogue row has id 0).
// A line is filed under its quote, so its triggers read the quote with a locking read (the newest
// committed state, not the transaction's snapshot). Foreign-key cascades fire no triggers: a quote's lines
// deleted with it are taken out by the quote's BEFORE DELETE trigger while they are still there.
// Each change that moves a count between two rows writes them in key order, so two opposite changes
// cannot deadlock (as quote_status_counts does).

const CONVERTED = (q) => `${q}.status IN ('deposit-paid', 'closed')`;
const MARGIN_KINDS = `('cam', 'part')`;

/** Adds (sign 1) or takes out (sign -1) one quote's row of report_quote_days. */
const quoteDay = (q, sign) =>
  `(DATE(${q}.created_at), ${q}.status, ${q}.sent_at IS NOT NULL, ${sign}, ${sign} * ${q}.total_cents)`;
const UPSERT_QUOTE_DAYS = `INSERT INTO report_quote_days (day, status, sent, quotes, value_cents) VALUES`;
const ADD_QUOTE_DAYS = `ON DUPLICATE KEY UPDATE quotes = quotes + VALUES(quotes), value_cents = value_cents + VALUES(value_cents)`;

/** Adds or takes out every margin line of one quote (its lines as they stand). */
const quoteLinesToMargin = (q, sign) => `
  INSERT INTO report_margin_days (day, kind, cam_id, part_id, quantity, line_count, revenue_cents)
  SELECT DATE(${q}.created_at), ql.kind, COALESCE(ql.cam_id, 0), COALESCE(ql.part_id, 0), ql.quantity, ${sign} * COUNT(*), ${sign} * SUM(ql.total_cents)
    FROM quote_lines ql WHERE ql.quote_id = ${q}.id AND ql.kind IN ${MARGIN_KINDS}
   GROUP BY ql.kind, COALESCE(ql.cam_id, 0), COALESCE(ql.part_id, 0), ql.quantity
   ORDER BY ql.kind, COALESCE(ql.cam_id, 0), COALESCE(ql.part_id, 0), ql.quantity
  ON DUPLICATE KEY UPDATE line_count = line_count + VALUES(line_count), revenue_cents = revenue_cents + VALUES(revenue_cents)`;

/** Adds or takes out one line, filed on the day its (converted) quote was created. */
const lineToMargin = (l, day, sign) => `
  INSERT INTO report_margin_days (day, kind, cam_id, part_id, quantity, line_count, revenue_cents)
  VALUES (${day}, ${l}.kind, COALESCE(${l}.cam_id, 0), COALESCE(${l}.part_id, 0), ${l}.quantity, ${sign}, ${sign} * ${l}.total_cents)
  ON DUPLICATE KEY UPDATE line_count = line_count + VALUES(line_count), revenue_cents = revenue_cents + VALUES(revenue_cents)`;

/** Sets `day` to the creation day of the line's quote when that quote is converted, else NULL. */
const convertedDayOf = (l, day) => `
  SET ${day} = NULL;
  SELECT IF(${CONVERTED('q')}, DATE(q.created_at), NULL) INTO ${day} FROM quotes q WHERE q.id = ${l}.quote_id LOCK IN SHARE MODE;`;

const TRIGGERS = {
  quotes_report_insert: `CREATE TRIGGER quotes_report_insert AFTER INSERT ON quotes FOR EACH ROW
    ${UPSERT_QUOTE_DAYS} ${quoteDay('NEW', 1)} ${ADD_QUOTE_DAYS}`,
  quotes_report_update: `CREATE TRIGGER quotes_report_update AFTER UPDATE ON quotes FOR EACH ROW
    BEGIN
      IF NOT (DATE(NEW.created_at) <=> DATE(OLD.created_at)) OR NEW.status <> OLD.status
         OR (NEW.sent_at IS NULL) <> (OLD.sent_at IS NULL) OR NEW.total_cents <> OLD.total_cents THEN
        IF (DATE(OLD.created_at), CAST(OLD.status AS CHAR), OLD.sent_at IS NOT NULL) <= (DATE(NEW.created_at), CAST(NEW.status AS CHAR), NEW.sent_at IS NOT NULL) THEN
          ${UPSERT_QUOTE_DAYS} ${quoteDay('OLD', -1)}, ${quoteDay('NEW', 1)} ${ADD_QUOTE_DAYS};
        ELSE
          ${UPSERT_QUOTE_DAYS} ${quoteDay('NEW', 1)}, ${quoteDay('OLD', -1)} ${ADD_QUOTE_DAYS};
        END IF;
      END IF;
      IF (${CONVERTED('OLD')}) <> (${CONVERTED('NEW')}) OR (${CONVERTED('NEW')} AND DATE(NEW.created_at) <> DATE(OLD.created_at)) THEN
        IF ${CONVERTED('OLD')} THEN ${quoteLinesToMargin('OLD', -1)}; END IF;
        IF ${CONVERTED('NEW')} THEN ${quoteLinesToMargin('NEW', 1)}; END IF;
      END IF;
    END`,
  quotes_report_delete: `CREATE TRIGGER quotes_report_delete BEFORE DELETE ON quotes FOR EACH ROW
    BEGIN
      ${UPSERT_QUOTE_DAYS} ${quoteDay('OLD', -1)} ${ADD_QUOTE_DAYS};
      IF ${CONVERTED('OLD')} THEN ${quoteLinesToMargin('OLD', -1)}; END IF;
    END`,
  quote_lines_report_insert: `CREATE TRIGGER quote_lines_report_insert AFTER INSERT ON quote_lines FOR EACH ROW
    BEGIN
      DECLARE converted_day DATE;
      IF NEW.kind IN ${MARGIN_KINDS} THEN
        ${convertedDayOf('NEW', 'converted_day')}
        IF converted_day IS NOT NULL THEN ${lineToMargin('NEW', 'converted_day', 1)}; END IF;
      END IF;
    END`,
  quote_lines_report_update: `CREATE TRIGGER quote_lines_report_update AFTER UPDATE ON quote_lines FOR EACH ROW
    BEGIN
      DECLARE old_day DATE;
      DECLARE new_day DATE;
      IF OLD.kind IN ${MARGIN_KINDS} THEN ${convertedDayOf('OLD', 'old_day')} END IF;
      IF NEW.kind IN ${MARGIN_KINDS} THEN ${convertedDayOf('NEW', 'new_day')} END IF;
      IF old_day IS NOT NULL THEN ${lineToMargin('OLD', 'old_day', -1)}; END IF;
      IF new_day IS NOT NULL THEN ${lineToMargin('NEW', 'new_day', 1)}; END IF;
    END`,
  quote_lines_report_delete: `CREATE TRIGGER quote_lines_report_delete AFTER DELETE ON quote_lines FOR EACH ROW
    BEGIN
      DECLARE converted_day DATE;
      IF OLD.kind IN ${MARGIN_KINDS} THEN
        ${convertedDayOf('OLD', 'converted_day')}
        IF converted_day IS NOT NULL THEN ${lineToMargin('OLD', 'converted_day', -1)}; END IF;
      END IF;
    END`,
};

/** Both tables recomputed from the rows as they stand (also what the integration test compares against). */
const BACKFILL = [
  'DELETE FROM report_quote_days',
  `INSERT INTO report_quote_days (day, status, sent, quotes, value_cents)
   SELECT DATE(created_at), status, sent_at IS NOT NULL, COUNT(*), SUM(total_cents) FROM quotes
    GROUP BY DATE(created_at), status, sent_at IS NOT NULL`,
  'DELETE FROM report_margin_days',
  `INSERT INTO report_margin_days (day, kind, cam_id, part_id, quantity, line_count, revenue_cents)
   SELECT DATE(q.created_at), ql.kind, COALESCE(ql.cam_id, 0), COALESCE(ql.part_id, 0), ql.quantity, COUNT(*), SUM(ql.total_cents)
     FROM quotes q JOIN quote_lines ql ON ql.quote_id = q.id
    WHERE ${CONVERTED('q')} AND ql.kind IN ${MARGIN_KINDS}
    GROUP BY DATE(q.created_at), ql.kind, COALESCE(ql.cam_id, 0), COALESCE(ql.part_id, 0), ql.quantity`,
];

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('report_quote_days', {
      day: { type: S.DATEONLY, allowNull: false, primaryKey: true },
      status: { type: S.STRING(32), allowNull: false, primaryKey: true },
      sent: { type: S.BOOLEAN, allowNull: false, primaryKey: true },
      quotes: { type: S.INTEGER, allowNull: false, defaultValue: 0 },
      value_cents: { type: S.BIGINT, allowNull: false, defaultValue: 0 },
    });
    await q.createTable('report_margin_days', {
      day: { type: S.DATEONLY, allowNull: false, primaryKey: true },
      kind: { type: S.STRING(8), allowNull: false, primaryKey: true },
      cam_id: { type: S.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      part_id: { type: S.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      quantity: { type: S.DECIMAL(8, 2), allowNull: false, primaryKey: true },
      line_count: { type: S.INTEGER, allowNull: false, defaultValue: 0 },
      revenue_cents: { type: S.BIGINT, allowNull: false, defaultValue: 0 },
    });
    // Triggers first, then the totals recomputed from the rows in one transaction (migrations run with the
    // app stopped; a quote written in between would be counted by its trigger and then recomputed).
    for (const sql of Object.values(TRIGGERS)) await q.sequelize.query(sql);
    await q.sequelize.transaction(async (transaction) => {
      for (const sql of BACKFILL) await q.sequelize.query(sql, { transaction });
    });
  },

  async down(q) {
    for (const name of Object.keys(TRIGGERS).reverse()) await q.sequelize.query(`DROP TRIGGER IF EXISTS ${name}`);
    await q.dropTable('report_margin_days');
    await q.dropTable('report_quote_days');
  },
};
