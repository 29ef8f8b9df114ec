'use strict';

// The first schema: every entity the product needs. Later work adds new migrations; this one is
// never edited once landed. Money is integer cents, rates are basis points (1 % = 100 bp).

/** @param {import('sequelize').DataTypes} S */
const timestamps = (S) => ({
  created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
  updated_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
});
const id = (S) => ({ id: { type: S.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true } });
const version = (S) => ({ version: { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 } });
const ref = (S, table, { nullable = true, onDelete = 'RESTRICT' } = {}) => ({
  type: S.INTEGER.UNSIGNED,
  allowNull: nullable,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete: nullable && onDelete === 'RESTRICT' ? 'SET NULL' : onDelete,
});
const cents = (S, allowNull = false) => ({ type: S.INTEGER, allowNull, defaultValue: allowNull ? null : 0 });

module.exports = {
  async up(q, S) {
    await q.createTable('users', {
      ...id(S),
      email: { type: S.STRING(254), allowNull: false, unique: true },
      name: { type: S.STRING(120), allowNull: false },
      password_hash: { type: S.STRING(255), allowNull: true },
      role: { type: S.ENUM('manager', 'counter', 'tech'), allowNull: false },
      active: { type: S.BOOLEAN, allowNull: false, defaultValue: true },
      ...version(S),
      ...timestamps(S),
    });

    await q.createTable('shop_settings', {
      ...id(S),
      name: { type: S.STRING(120), allowNull: false },
      address: { type: S.STRING(255), allowNull: false, defaultValue: '' },
      phone: { type: S.STRING(40), allowNull: false, defaultValue: '' },
      email: { type: S.STRING(254), allowNull: false, defaultValue: '' },
      tax_rate_bp: { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      labor_rate_cents: cents(S),
      deposit_percent_bp: { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 2000 },
      deposit_min_cents: cents(S),
      deposit_max_cents: cents(S),
      deposit_policy_text: { type: S.TEXT, allowNull: false },
      currency: { type: S.CHAR(3), allowNull: false, defaultValue: 'usd' },
      ...version(S),
      ...timestamps(S),
    });

    await q.createTable('suppliers', {
      ...id(S),
      name: { type: S.STRING(120), allowNull: false, unique: true },
      contact_email: { type: S.STRING(254), allowNull: true },
      ...timestamps(S),
    });

    await q.createTable('cams', {
      ...id(S),
      sku: { type: S.STRING(40), allowNull: false, unique: true },
      name: { type: S.STRING(120), allowNull: false },
      supplier_id: ref(S, 'suppliers'),
      intake_duration_050: { type: S.DOUBLE, allowNull: false },
      exhaust_duration_050: { type: S.DOUBLE, allowNull: false },
      intake_advertised: { type: S.DOUBLE, allowNull: true },
      exhaust_advertised: { type: S.DOUBLE, allowNull: true },
      intake_lift_in: { type: S.DOUBLE, allowNull: false },
      exhaust_lift_in: { type: S.DOUBLE, allowNull: false },
      lsa: { type: S.DOUBLE, allowNull: false },
      intake_centerline: { type: S.DOUBLE, allowNull: false },
      rocker_ratio: { type: S.DOUBLE, allowNull: false, defaultValue: 1.7 },
      deactivation_compatible: { type: S.BOOLEAN, allowNull: false, defaultValue: false },
      emissions_certified: { type: S.BOOLEAN, allowNull: false, defaultValue: false },
      spring_max_lift_in: { type: S.DOUBLE, allowNull: true },
      is_factory_baseline: { type: S.BOOLEAN, allowNull: false, defaultValue: false },
      baseline_for_liters: { type: S.DECIMAL(3, 1), allowNull: true },
      price_cents: cents(S),
      cost_cents: cents(S),
      stock_on_hand: { type: S.INTEGER, allowNull: false, defaultValue: 0 },
      active: { type: S.BOOLEAN, allowNull: false, defaultValue: true },
      archived_at: { type: S.DATE, allowNull: true },
      notes: { type: S.TEXT, allowNull: true },
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('cams', ['active', 'intake_duration_050']);
    await q.addIndex('cams', ['supplier_id']);
    await q.addIndex('cams', ['lsa']);

    await q.createTable('parts', {
      ...id(S),
      sku: { type: S.STRING(40), allowNull: false, unique: true },
      name: { type: S.STRING(160), allowNull: false },
      category: {
        type: S.ENUM('springs', 'pushrods', 'lifters', 'deactivation-delete', 'timing', 'gaskets', 'converter', 'tune', 'hardware', 'other'),
        allowNull: false,
      },
      supplier_id: ref(S, 'suppliers'),
      price_cents: cents(S),
      cost_cents: cents(S),
      stock_on_hand: { type: S.INTEGER, allowNull: false, defaultValue: 0 },
      spec: { type: S.JSON, allowNull: true },
      active: { type: S.BOOLEAN, allowNull: false, defaultValue: true },
      notes: { type: S.TEXT, allowNull: true },
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('parts', ['category', 'active']);

    await q.createTable('labor_operations', {
      ...id(S),
      code: { type: S.STRING(40), allowNull: false, unique: true },
      name: { type: S.STRING(160), allowNull: false },
      hours: { type: S.DECIMAL(5, 2), allowNull: false },
      engines: { type: S.STRING(255), allowNull: false, defaultValue: 'all' },
      active: { type: S.BOOLEAN, allowNull: false, defaultValue: true },
      ...version(S),
      ...timestamps(S),
    });

    await q.createTable('need_rules', {
      ...id(S),
      kind: { type: S.ENUM('lift-over', 'deactivation-active', 'crossover-over-stall', 'always'), allowNull: false },
      threshold: { type: S.DOUBLE, allowNull: true },
      label: { type: S.STRING(160), allowNull: false },
      active: { type: S.BOOLEAN, allowNull: false, defaultValue: true },
      ...version(S),
      ...timestamps(S),
    });
    await q.createTable('need_rule_items', {
      ...id(S),
      rule_id: ref(S, 'need_rules', { nullable: false, onDelete: 'CASCADE' }),
      part_id: ref(S, 'parts'),
      labor_operation_id: ref(S, 'labor_operations'),
      quantity: { type: S.DECIMAL(8, 2), allowNull: false, defaultValue: 1 },
      ...timestamps(S),
    });

    await q.createTable('customers', {
      ...id(S),
      name: { type: S.STRING(120), allowNull: false },
      email: { type: S.STRING(254), allowNull: true },
      phone: { type: S.STRING(40), allowNull: true },
      notes: { type: S.TEXT, allowNull: true },
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('customers', ['email']);

    await q.createTable('builds', {
      ...id(S),
      customer_id: ref(S, 'customers', { nullable: false, onDelete: 'CASCADE' }),
      vehicle_label: { type: S.STRING(160), allowNull: false },
      profile: { type: S.JSON, allowNull: false },
      profile_schema_version: { type: S.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
      baseline_cam_id: ref(S, 'cams'),
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('builds', ['customer_id']);

    await q.createTable('interviews', {
      ...id(S),
      build_id: ref(S, 'builds', { nullable: false, onDelete: 'CASCADE' }),
      staff_user_id: ref(S, 'users'),
      status: { type: S.ENUM('in-progress', 'complete', 'abandoned'), allowNull: false, defaultValue: 'in-progress' },
      answers: { type: S.JSON, allowNull: true },
      ranking_snapshot: { type: S.JSON, allowNull: true },
      chosen_cam_id: ref(S, 'cams'),
      completed_at: { type: S.DATE, allowNull: true },
      ...version(S),
      ...timestamps(S),
    });

    await q.createTable('quotes', {
      ...id(S),
      number: { type: S.STRING(20), allowNull: false, unique: true },
      customer_id: ref(S, 'customers', { nullable: false }),
      build_id: ref(S, 'builds'),
      cam_id: ref(S, 'cams'),
      created_by_user_id: ref(S, 'users'),
      status: {
        type: S.ENUM('draft', 'sent', 'accepted', 'deposit-paid', 'declined', 'expired', 'cancelled'),
        allowNull: false,
        defaultValue: 'draft',
      },
      public_token_hash: { type: S.CHAR(64), allowNull: true, unique: true },
      subtotal_cents: cents(S),
      tax_rate_bp: { type: S.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      tax_cents: cents(S),
      total_cents: cents(S),
      deposit_cents: cents(S),
      valid_until: { type: S.DATEONLY, allowNull: true },
      sent_at: { type: S.DATE, allowNull: true },
      accepted_at: { type: S.DATE, allowNull: true },
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('quotes', ['status', 'created_at']);
    await q.addIndex('quotes', ['customer_id']);

    await q.createTable('quote_lines', {
      ...id(S),
      quote_id: ref(S, 'quotes', { nullable: false, onDelete: 'CASCADE' }),
      kind: { type: S.ENUM('cam', 'part', 'labor', 'tune', 'other'), allowNull: false },
      cam_id: ref(S, 'cams'),
      part_id: ref(S, 'parts'),
      labor_operation_id: ref(S, 'labor_operations'),
      description: { type: S.STRING(255), allowNull: false },
      quantity: { type: S.DECIMAL(8, 2), allowNull: false, defaultValue: 1 },
      unit_price_cents: cents(S),
      total_cents: cents(S),
      sort_order: { type: S.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
      ...timestamps(S),
    });

    await q.createTable('payments', {
      ...id(S),
      quote_id: ref(S, 'quotes', { nullable: false }),
      provider: { type: S.STRING(20), allowNull: false, defaultValue: 'stripe' },
      provider_session_id: { type: S.STRING(255), allowNull: true, unique: true },
      provider_payment_id: { type: S.STRING(255), allowNull: true },
      amount_cents: cents(S),
      refunded_cents: cents(S),
      currency: { type: S.CHAR(3), allowNull: false, defaultValue: 'usd' },
      status: {
        type: S.ENUM('pending', 'paid', 'failed', 'expired', 'refunded', 'partially-refunded'),
        allowNull: false,
        defaultValue: 'pending',
      },
      paid_at: { type: S.DATE, allowNull: true },
      ...timestamps(S),
    });
    await q.addIndex('payments', ['quote_id']);

    await q.createTable('leads', {
      ...id(S),
      name: { type: S.STRING(120), allowNull: false },
      email: { type: S.STRING(254), allowNull: true },
      phone: { type: S.STRING(40), allowNull: true },
      answers: { type: S.JSON, allowNull: false },
      shortlist: { type: S.JSON, allowNull: true },
      status: { type: S.ENUM('new', 'contacted', 'quoted', 'closed'), allowNull: false, defaultValue: 'new' },
      public_token_hash: { type: S.CHAR(64), allowNull: true, unique: true },
      customer_id: ref(S, 'customers'),
      ...version(S),
      ...timestamps(S),
    });
    await q.addIndex('leads', ['status', 'created_at']);

    await q.createTable('dyno_runs', {
      ...id(S),
      build_id: ref(S, 'builds', { nullable: false, onDelete: 'CASCADE' }),
      quote_id: ref(S, 'quotes'),
      cam_id: ref(S, 'cams'),
      recorded_by_user_id: ref(S, 'users'),
      phase: { type: S.ENUM('before', 'after'), allowNull: false },
      run_at: { type: S.DATE, allowNull: false },
      correction_standard: { type: S.ENUM('sae-j1349', 'sae-j607', 'din-70020', 'none'), allowNull: false, defaultValue: 'sae-j1349' },
      air_temp_c: { type: S.DOUBLE, allowNull: true },
      baro_kpa: { type: S.DOUBLE, allowNull: true },
      humidity_pct: { type: S.DOUBLE, allowNull: true },
      peak_hp: { type: S.DOUBLE, allowNull: true },
      peak_hp_rpm: { type: S.INTEGER.UNSIGNED, allowNull: true },
      peak_torque_lb_ft: { type: S.DOUBLE, allowNull: true },
      peak_torque_rpm: { type: S.INTEGER.UNSIGNED, allowNull: true },
      curve: { type: S.JSON, allowNull: true },
      notes: { type: S.TEXT, allowNull: true },
      ...timestamps(S),
    });
    await q.addIndex('dyno_runs', ['build_id', 'phase']);
    await q.addIndex('dyno_runs', ['cam_id']);

    await q.createTable('audit_log', {
      id: { type: S.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      user_id: ref(S, 'users'),
      actor: { type: S.STRING(254), allowNull: false },
      action: { type: S.STRING(64), allowNull: false },
      entity_type: { type: S.STRING(40), allowNull: true },
      entity_id: { type: S.STRING(40), allowNull: true },
      before: { type: S.JSON, allowNull: true },
      after: { type: S.JSON, allowNull: true },
      ip: { type: S.STRING(64), allowNull: true },
      created_at: { type: S.DATE, allowNull: false, defaultValue: S.literal('CURRENT_TIMESTAMP') },
    });
    await q.addIndex('audit_log', ['entity_type', 'entity_id']);
    await q.addIndex('audit_log', ['created_at']);
  },

  async down(q) {
    for (const table of [
      'audit_log', 'dyno_runs', 'leads', 'payments', 'quote_lines', 'quotes', 'interviews', 'builds',
      'customers', 'need_rule_items', 'need_rules', 'labor_operations', 'parts', 'cams', 'suppliers',
      'shop_settings', 'users',
    ]) {
      await q.dropTable(table);
    }
  },
};
