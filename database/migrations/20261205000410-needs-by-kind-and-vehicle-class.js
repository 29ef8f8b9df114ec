'use strict';

// Issue 12, item 1: one source of truth for what a cam needs.
// - need_rules: a rule now names the advisor's need kind it prices (the advisor alone decides when a cam
//   needs springs, a converter, …) and optionally a vehicle class. Old kinds are renamed in place
//   (lift-over → springs, deactivation-active → deactivation-delete, crossover-over-stall → converter,
//   always → tune); the threshold column is left as it was, unread, so `down` can give it back.
// - The demo shop's labour list (codes CAM-TRUCK and CAM-CAR) gets its cam-install rules; any other shop
//   adds its own on the rules page, which lists the vehicle classes still without one.
// - builds: build profiles move to schema 2. vehicle.class is filled in from the vehicle's label
//   ("pickup", "SUV", "van", "coupe", …), else from the intake (a truck-style intake → truck, else car).
//   Every existing field keeps its name; profiles without the class still read (it is optional).

const OLD_KINDS = ['lift-over', 'deactivation-active', 'crossover-over-stall', 'always'];
const NEW_KINDS = ['install', 'springs', 'pushrods', 'lifters', 'deactivation-delete', 'converter', 'tune'];
const RENAMED = { 'lift-over': 'springs', 'deactivation-active': 'deactivation-delete', 'crossover-over-stall': 'converter', always: 'tune' };
// Schema 1 needed a threshold on these kinds; down gives back the demo's value when a rule has none.
const OLD_DEFAULT_THRESHOLD = { 'lift-over': 0.57, 'crossover-over-stall': 600 };
const VEHICLE_CLASSES = ['truck', 'suv', 'van', 'car'];
// The demo's schema-1 labels named their own thresholds; only these exact texts are reworded.
const DEMO_LABELS = {
  'Lift over 0.570" needs the ovate spring kit': 'Past the installed springs’ limit: the ovate spring kit, installed and checked',
  'Crossover 600+ rpm over stall: suggest a 2,800 converter': 'Pulls well above the stall: a 2,800 converter, installed',
};

/** The class a saved build's label and intake suggest (same default as vehicleClassOf() in the app). */
function classFor(label, profile) {
  const text = String(label || '').toLowerCase();
  if (/\b(pickup|pick-up|truck)\b/.test(text)) return 'truck';
  if (/\b(suv|sport utility)\b/.test(text)) return 'suv';
  if (/\bvan\b/.test(text)) return 'van';
  if (/\b(coupe|sedan|car|convertible|hatchback|wagon)\b/.test(text)) return 'car';
  return profile && profile.engine && profile.engine.intakeManifold === 'truck' ? 'truck' : 'car';
}

const readJson = (value) => (typeof value === 'string' ? JSON.parse(value) : value);

/** A stored profile as schema 2 writes it: every field as it was, plus vehicle.class when it had none. */
function profileToV2(label, stored) {
  const profile = readJson(stored);
  if (!profile || typeof profile !== 'object' || !profile.vehicle || typeof profile.vehicle !== 'object' || profile.vehicle.class) return profile;
  return { ...profile, vehicle: { ...profile.vehicle, class: classFor(label, profile) } };
}

/** Back to schema 1: the class taken out, nothing else touched. */
function profileToV1(stored) {
  const profile = readJson(stored);
  if (!profile || typeof profile !== 'object' || !profile.vehicle || typeof profile.vehicle !== 'object') return profile;
  const vehicle = { ...profile.vehicle };
  delete vehicle.class;
  return { ...profile, vehicle };
}

async function setKindEnum(q, S, values, t) {
  await q.changeColumn('need_rules', 'kind', { type: S.ENUM(...values), allowNull: false }, { transaction: t });
}

/** @type {import('sequelize-cli').Migration & { profileToV2: typeof profileToV2, profileToV1: typeof profileToV1 }} */
module.exports = {
  // Pure, exported for tests/unit/schemas/profile-v2-migration.test.ts.
  profileToV2,
  profileToV1,

  async up(q, S) {
    // MariaDB commits DDL implicitly; the transaction covers the row rewrites between the column changes.
    await setKindEnum(q, S, [...OLD_KINDS, ...NEW_KINDS.filter((k) => !OLD_KINDS.includes(k))]);
    await q.sequelize.transaction(async (t) => {
      for (const [from, to] of Object.entries(RENAMED)) {
        await q.sequelize.query('UPDATE need_rules SET kind = ? WHERE kind = ?', { replacements: [to, from], transaction: t });
      }
      for (const [from, to] of Object.entries(DEMO_LABELS)) {
        await q.sequelize.query('UPDATE need_rules SET label = ? WHERE label = ?', { replacements: [to, from], transaction: t });
      }
    });
    await setKindEnum(q, S, NEW_KINDS);
    await q.addColumn('need_rules', 'vehicle_class', { type: S.ENUM(...VEHICLE_CLASSES), allowNull: true, after: 'kind' });

    await q.sequelize.transaction(async (t) => {
      const [ops] = await q.sequelize.query("SELECT id, code FROM labor_operations WHERE code IN ('CAM-TRUCK', 'CAM-CAR')", { transaction: t });
      const [installs] = await q.sequelize.query("SELECT id FROM need_rules WHERE kind = 'install'", { transaction: t });
      const op = (code) => ops.find((o) => o.code === code);
      if (installs.length === 0 && op('CAM-TRUCK') && op('CAM-CAR')) {
        const now = new Date();
        for (const [vehicleClass, code, label] of [
          [null, 'CAM-TRUCK', 'Cam install: trucks, SUVs and vans get the truck cam swap'],
          ['car', 'CAM-CAR', 'Cam install: cars get the car cam swap (tighter engine bay)'],
        ]) {
          await q.sequelize.query(
            "INSERT INTO need_rules (kind, vehicle_class, threshold, label, active, version, created_at, updated_at) VALUES ('install', ?, NULL, ?, 1, 1, ?, ?)",
            { replacements: [vehicleClass, label, now, now], transaction: t },
          );
          const [[{ id }]] = await q.sequelize.query('SELECT LAST_INSERT_ID() AS id', { transaction: t });
          await q.sequelize.query(
            'INSERT INTO need_rule_items (rule_id, part_id, labor_operation_id, quantity, created_at, updated_at) VALUES (?, NULL, ?, 1, ?, ?)',
            { replacements: [id, op(code).id, now, now], transaction: t },
          );
        }
      }

      const [builds] = await q.sequelize.query('SELECT id, vehicle_label, profile FROM builds WHERE profile_schema_version < 2 FOR UPDATE', { transaction: t });
      for (const build of builds) {
        const profile = profileToV2(build.vehicle_label, build.profile);
        await q.sequelize.query('UPDATE builds SET profile = ?, profile_schema_version = 2 WHERE id = ?', { replacements: [JSON.stringify(profile), build.id], transaction: t });
      }
    });
  },

  async down(q, S) {
    await q.sequelize.transaction(async (t) => {
      const [builds] = await q.sequelize.query('SELECT id, profile FROM builds WHERE profile_schema_version >= 2 FOR UPDATE', { transaction: t });
      for (const build of builds) {
        const profile = profileToV1(build.profile);
        await q.sequelize.query('UPDATE builds SET profile = ?, profile_schema_version = 1 WHERE id = ?', { replacements: [JSON.stringify(profile), build.id], transaction: t });
      }
      // Schema 1 has no kind for these; their items go with them (need_rule_items cascades).
      await q.sequelize.query("DELETE FROM need_rules WHERE kind IN ('install', 'pushrods', 'lifters')", { transaction: t });
    });
    await q.removeColumn('need_rules', 'vehicle_class');
    await setKindEnum(q, S, [...OLD_KINDS, ...NEW_KINDS.filter((k) => !OLD_KINDS.includes(k))]);
    await q.sequelize.transaction(async (t) => {
      for (const [from, to] of Object.entries(RENAMED)) {
        await q.sequelize.query('UPDATE need_rules SET kind = ? WHERE kind = ?', { replacements: [from, to], transaction: t });
      }
      for (const [from, to] of Object.entries(DEMO_LABELS)) {
        await q.sequelize.query('UPDATE need_rules SET label = ? WHERE label = ?', { replacements: [from, to], transaction: t });
      }
      for (const [kind, threshold] of Object.entries(OLD_DEFAULT_THRESHOLD)) {
        await q.sequelize.query('UPDATE need_rules SET threshold = ? WHERE kind = ? AND threshold IS NULL', { replacements: [threshold, kind], transaction: t });
      }
    });
    await setKindEnum(q, S, OLD_KINDS);
  },
};
