'use strict';

// Leads that go cold (issue 9, item 4): the shop sets after how many days a new lead that nobody has
// called or written a note on is flagged on the leads list and the staff home page. Two days to start.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('shop_settings', 'lead_stale_days', { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 2 });
  },

  async down(q) {
    await q.removeColumn('shop_settings', 'lead_stale_days');
  },
};
