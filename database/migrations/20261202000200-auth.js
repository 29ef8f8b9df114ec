'use strict';

// Sign-in support: server-side staff sessions (so sign-out and deactivation take effect at once),
// single-use password tokens (reset and invitation; only a SHA-256 of the token is stored) and the
// sign-in attempts that throttling counts (kept in MariaDB so several app instances agree).

module.exports = {
  async up(q, S) {
    await q.createTable('staff_sessions', {
      id: { type: S.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      token_hash: { type: S.CHAR(64), allowNull: false, unique: true },
      user_id: {
        type: S.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'users', key: 'id' },
        onUpdate: 'CASCADE',
        onDelete: 'CASCADE',
      },
      ip: { type: S.STRING(64), allowNull: true },
      user_agent: { type: S.STRING(255), allowNull: true },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
      last_seen_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
      expires_at: { type: S.DATE, allowNull: false },
      revoked_at: { type: S.DATE, allowNull: true },
    });
    await q.addIndex('staff_sessions', ['user_id', 'revoked_at']);

    await q.createTable('password_reset_tokens', {
      id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      user_id: {
        type: S.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'users', key: 'id' },
        onUpdate: 'CASCADE',
        onDelete: 'CASCADE',
      },
      token_hash: { type: S.CHAR(64), allowNull: false, unique: true },
      purpose: { type: S.ENUM('reset', 'invite'), allowNull: false, defaultValue: 'reset' },
      expires_at: { type: S.DATE, allowNull: false },
      used_at: { type: S.DATE, allowNull: true },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
    });
    await q.addIndex('password_reset_tokens', ['user_id', 'used_at']);

    await q.createTable('sign_in_attempts', {
      id: { type: S.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      email: { type: S.STRING(254), allowNull: false },
      ip: { type: S.STRING(64), allowNull: false },
      succeeded: { type: S.BOOLEAN, allowNull: false },
      created_at: { type: S.DATE(3), allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP(3)') },
    });
    await q.addIndex('sign_in_attempts', ['email', 'created_at']);
    await q.addIndex('sign_in_attempts', ['ip', 'created_at']);
  },

  async down(q) {
    await q.dropTable('sign_in_attempts');
    await q.dropTable('password_reset_tokens');
    await q.dropTable('staff_sessions');
  },
};
