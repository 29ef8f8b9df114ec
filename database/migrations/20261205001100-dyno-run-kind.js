'use strict';

// Engine dyno or chassis dyno (issue 9, item 1). A chassis dyno reads power at the wheels, after the
// gearbox, converter and axle have taken their share; an engine dyno reads it at the flywheel. The two
// are never compared with each other, so every run says which it was. Runs recorded before this column
// were all made with the car on the rollers at the counter's jobs, so they become chassis runs.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.addColumn('dyno_runs', 'dyno_type', { type: S.ENUM('chassis', 'engine'), allowNull: false, defaultValue: 'chassis', after: 'phase' });
  },

  async down(q) {
    await q.removeColumn('dyno_runs', 'dyno_type');
  },
};
