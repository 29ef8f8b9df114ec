'use strict';

// The job board and the technician's sign-off (issue 9, items 2 and 3).
// - jobs: one row per deposit-paid quote once it is booked (a paid quote without a row is "not booked
//   yet"), so the board never needs a write to show a freshly paid job. quote_id is unique: two people
//   booking the same job at once cannot make two rows.
// - job_sign_offs: the checks a technician records before the job may be marked ready. Rows are kept
//   (the newest counts), so a re-check never erases what was measured first.

const ref = (S, table, { nullable = true, onDelete = 'SET NULL' } = {}) => ({
  type: S.INTEGER.UNSIGNED,
  allowNull: nullable,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete,
});
const timestamps = (S) => ({
  created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
  updated_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
});
const inches = (S) => ({ type: S.DOUBLE, allowNull: false });

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('jobs', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      quote_id: { ...ref(S, 'quotes', { nullable: false, onDelete: 'CASCADE' }), unique: true },
      state: { type: S.ENUM('booked', 'in-shop', 'on-dyno', 'ready', 'collected'), allowNull: false, defaultValue: 'booked' },
      booked_for: { type: S.DATEONLY, allowNull: false },
      bay: { type: S.TINYINT.UNSIGNED, allowNull: true },
      technician_user_id: ref(S, 'users'),
      state_changed_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
      version: { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      ...timestamps(S),
    });
    await q.addIndex('jobs', ['booked_for', 'id']);
    await q.createTable('job_sign_offs', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      job_id: ref(S, 'jobs', { nullable: false, onDelete: 'CASCADE' }),
      ptv_intake_in: inches(S),
      ptv_exhaust_in: inches(S),
      spring_installed_height_in: inches(S),
      spring_seat_pressure_lb: inches(S),
      coil_bind_margin_in: inches(S),
      pushrod_length_in: inches(S),
      lifter_preload_in: inches(S),
      // null: the build has no active cylinder deactivation, so the question was not asked.
      deactivation_delete_done: { type: S.BOOLEAN, allowNull: true },
      tune_file: { type: S.STRING(120), allowNull: false },
      notes: { type: S.TEXT, allowNull: true },
      signed_by_user_id: ref(S, 'users'),
      ...timestamps(S),
    });
    await q.addIndex('job_sign_offs', ['job_id', 'id']);
  },

  async down(q) {
    await q.dropTable('job_sign_offs');
    await q.dropTable('jobs');
  },
};
