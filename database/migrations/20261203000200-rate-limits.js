'use strict';

// Counters for sign-in and lead throttling, kept by rate-limiter-flexible (RateLimiterMySQL) so every
// app instance shares them and each check-and-count is one atomic upsert. The library reads and
// writes exactly these three columns, in this order; `expire` is milliseconds since the epoch.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q) {
    await q.sequelize.query(
      'CREATE TABLE rate_limits (' +
        '`key` VARCHAR(255) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,' +
        '`points` INT NOT NULL DEFAULT 0,' +
        '`expire` BIGINT UNSIGNED NULL,' +
        'PRIMARY KEY (`key`), KEY rate_limits_expire (`expire`)' +
        ') ENGINE = InnoDB',
    );
  },

  async down(q) {
    await q.dropTable('rate_limits');
  },
};
