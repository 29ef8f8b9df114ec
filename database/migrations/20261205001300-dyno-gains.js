'use strict';

// Issue 11, item 5: the advisor's measured history, one row per build, fitted cam and kind of dyno, so a ranking
// reads only the jobs on engines similar to the one being ranked (a range on the displacement index,
// bounded) instead of every dyno run and every build profile. Rows are written by the app in the same
// transaction as the dyno run or build edit they follow from (src/lib/db/queries/dyno-gains.ts);
// `npm run dyno:reindex` fills the table from the runs already stored before this migration.

const ref = (S, table) => ({ type: S.INTEGER.UNSIGNED, allowNull: false, references: { model: table, key: 'id' }, onUpdate: 'CASCADE', onDelete: 'CASCADE' });

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('dyno_gains', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      build_id: ref(S, 'builds'),
      cam_id: ref(S, 'cams'),
      // Before and after pulls are paired on one kind of dyno only, so a build can hold one result per kind.
      dyno_type: { type: S.ENUM('chassis', 'engine'), allowNull: false },
      displacement_ci: { type: S.DOUBLE, allowNull: false },
      intake_flow_cfm: { type: S.DOUBLE, allowNull: false },
      headers: { type: S.STRING(16), allowNull: false },
      exhaust_system: { type: S.STRING(16), allowNull: false },
      intake_manifold: { type: S.STRING(16), allowNull: false },
      gain_pct_peak_hp: { type: S.DOUBLE, allowNull: false },
      gain_pct_by_rpm: { type: S.JSON, allowNull: true },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
      updated_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
    });
    await q.addIndex('dyno_gains', ['build_id', 'cam_id', 'dyno_type'], { unique: true, name: 'dyno_gains_build_cam' });
    // Nearest displacement first on either side of the engine being ranked, port flow checked in the index.
    await q.addIndex('dyno_gains', ['displacement_ci', 'intake_flow_cfm'], { name: 'dyno_gains_similar' });
    // The same for one cam (a quote being drafted, a snapshot).
    await q.addIndex('dyno_gains', ['cam_id', 'displacement_ci', 'intake_flow_cfm'], { name: 'dyno_gains_cam_similar' });
  },

  async down(q) {
    await q.dropTable('dyno_gains');
  },
};
