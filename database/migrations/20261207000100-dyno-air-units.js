'use strict';

// Dyno air conditions in the shop's units (issue 9, item 1): the job page asks for and shows the dyno
// cell's air in °F and inHg ('imperial', the default, like the rest of the product) or in °C and kPa
// ('metric'). Runs are stored in °C and kPa either way; this only says how people type and read them.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('shop_settings', 'dyno_air_units', {
      type: S.ENUM('imperial', 'metric'),
      allowNull: false,
      defaultValue: 'imperial',
    });
  },

  async down(q) {
    await q.removeColumn('shop_settings', 'dyno_air_units');
  },
};
