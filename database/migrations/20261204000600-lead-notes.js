'use strict';

// A note log per lead (issue 9, item 4): who spoke to the customer, when, and what was said. Notes are
// only ever added, never edited, so the log is what happened; deleting a lead takes its notes with it.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('lead_notes', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      lead_id: { type: S.INTEGER.UNSIGNED, allowNull: false, references: { model: 'leads', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'CASCADE' },
      user_id: { type: S.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onUpdate: 'CASCADE', onDelete: 'SET NULL' },
      body: { type: S.TEXT, allowNull: false },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
      updated_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
    });
    await q.addIndex('lead_notes', ['lead_id', 'id']);
  },

  async down(q) {
    await q.dropTable('lead_notes');
  },
};
