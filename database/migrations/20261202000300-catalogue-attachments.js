'use strict';

// Spec sheets (PDF or image) a manager attaches to a cam, part or labour operation. The bytes live in
// the storage module (var/uploads locally); this table holds what the app needs to list and serve them.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(q, S) {
    await q.createTable('catalogue_attachments', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      entity_type: { type: S.ENUM('cam', 'part', 'labor'), allowNull: false },
      entity_id: { type: S.INTEGER.UNSIGNED, allowNull: false },
      storage_key: { type: S.STRING(200), allowNull: false, unique: true },
      file_name: { type: S.STRING(160), allowNull: false },
      content_type: { type: S.ENUM('application/pdf', 'image/png', 'image/jpeg'), allowNull: false },
      byte_size: { type: S.INTEGER.UNSIGNED, allowNull: false },
      sha256: { type: S.CHAR(64), allowNull: false },
      uploaded_by_user_id: {
        type: S.INTEGER.UNSIGNED,
        allowNull: true,
        references: { model: 'users', key: 'id' },
        onUpdate: 'CASCADE',
        onDelete: 'SET NULL',
      },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
    });
    await q.addIndex('catalogue_attachments', ['entity_type', 'entity_id']);
  },

  async down(q) {
    await q.dropTable('catalogue_attachments');
  },
};
