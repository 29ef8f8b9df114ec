'use strict';

// The demo: an invented shop in an invented town, invented suppliers, grinds and customers.
// Factory-style baseline cards are approximate figures from memory, for demonstration only.
const crypto = require('crypto');
const argon2 = require('argon2');

const DEMO_PASSWORD = 'lobewise-demo';
const now = new Date();
const stamp = { created_at: now, updated_at: now };
// Demo quotes stay valid for 60 days from the day the demo is seeded, never from a fixed date.
const validUntil = new Date(now.getTime() + 60 * 86_400_000).toISOString().slice(0, 10);
const sha256 = (text) => crypto.createHash('sha256').update(text).digest('hex');

const users = [
  { id: 1, email: 'manager@lobewise.test', name: 'Rhea Castellan', role: 'manager' },
  { id: 2, email: 'counter@lobewise.test', name: 'Joel Pembry', role: 'counter' },
  { id: 3, email: 'tech@lobewise.test', name: 'Aurelio Banks', role: 'tech' },
];

const suppliers = [
  { id: 1, name: 'Ridgeback Grind Co.', contact_email: 'orders@ridgeback-grind.example' },
  { id: 2, name: 'Lantern Valley Cams', contact_email: 'sales@lantern-valley.example' },
  { id: 3, name: 'Foundry Nine Valvetrain', contact_email: 'desk@foundry-nine.example' },
  { id: 4, name: 'Prairie Drivetrain Supply', contact_email: 'counter@prairie-drivetrain.example' },
];

const { camRows } = require('../demo-cams.cjs');

const liters = { 'FB-48': 4.8, 'FB-53': 5.3, 'FB-57': 5.7, 'FB-60': 6.0, 'FB-62': 6.2 };

// [sku, name, category, supplier, price $, cost $, stock, spec]
const partRows = [
  [
    'SPR-570',
    'Conical spring kit, 0.570" max lift',
    'springs',
    1,
    289,
    170,
    4,
    { maxLiftIn: 0.57, seatLb: 125, openLb: 310 },
  ],
  [
    'SPR-600',
    'Ovate-wire spring kit, 0.600" max lift',
    'springs',
    1,
    349,
    205,
    5,
    { maxLiftIn: 0.6, seatLb: 135, openLb: 350 },
  ],
  [
    'SPR-660',
    'Dual spring kit with retainers, 0.660" max lift',
    'springs',
    3,
    469,
    280,
    2,
    { maxLiftIn: 0.66, seatLb: 150, openLb: 420 },
  ],
  ['PR-7400', 'Hardened pushrods 7.400" (16)', 'pushrods', 3, 169, 95, 6, { lengthIn: 7.4 }],
  ['PR-7350', 'Hardened pushrods 7.350" (16)', 'pushrods', 3, 169, 95, 3, { lengthIn: 7.35 }],
  ['PR-CHK', 'Adjustable pushrod length checker', 'pushrods', 3, 39, 18, 2, null],
  ['LIF-16', 'Non-deactivating roller lifter set (16)', 'lifters', 2, 329, 210, 4, null],
  ['LIF-TRAY', 'Lifter guide trays (4)', 'lifters', 2, 79, 44, 8, null],
  [
    'DD-KIT-53',
    'Cylinder deactivation delete kit, 4.8–6.0 L (lifters, trays, valley cover, tune note)',
    'deactivation-delete',
    2,
    649,
    410,
    3,
    null,
  ],
  ['DD-KIT-62', 'Cylinder deactivation delete kit, 6.2 L', 'deactivation-delete', 2, 699, 445, 1, null],
  ['DD-COVER', 'Valley cover, delete style, with breather', 'deactivation-delete', 2, 119, 70, 3, null],
  ['TS-SR', 'Single-roller timing set', 'timing', 3, 119, 66, 5, null],
  ['TS-DR', 'Double-roller timing set', 'timing', 3, 189, 110, 3, null],
  ['TS-TEN', 'Timing chain tensioner', 'timing', 3, 59, 31, 6, null],
  ['TS-BOLT', 'Cam bolt set, 3-bolt', 'hardware', 3, 24, 9, 10, null],
  ['HW-RET', 'Cam retainer plate with seal', 'hardware', 3, 49, 24, 6, null],
  ['HW-TRUN', 'Rocker trunnion upgrade kit', 'hardware', 1, 199, 118, 3, null],
  ['HW-OIL', 'Break-in oil and filter (7 qt)', 'hardware', 4, 79, 41, 12, null],
  ['GS-TC', 'Timing cover gasket set', 'gaskets', 4, 39, 17, 9, null],
  ['GS-SEAL', 'Front and rear main seal kit', 'gaskets', 4, 59, 27, 6, null],
  ['GS-VC', 'Valve cover gasket pair', 'gaskets', 4, 45, 20, 8, null],
  ['GS-INT', 'Intake manifold gasket set', 'gaskets', 4, 49, 22, 8, null],
  ['GS-WP', 'Water pump gasket pair', 'gaskets', 4, 19, 7, 8, null],
  ['TC-2400', 'Torque converter, 2,400 rpm stall', 'converter', 4, 749, 470, 1, { stallRpm: 2400 }],
  ['TC-2800', 'Torque converter, 2,800 rpm stall', 'converter', 4, 829, 520, 2, { stallRpm: 2800 }],
  ['TC-3200', 'Torque converter, 3,200 rpm stall', 'converter', 4, 899, 560, 1, { stallRpm: 3200 }],
  ['TUNE-DYNO', 'Dyno tune (engine and transmission calibration)', 'tune', null, 495, 0, 99, null],
  ['TUNE-REV', 'Tune revision after a follow-up visit', 'tune', null, 150, 0, 99, null],
];

// [code, name, hours, engines]
const laborRows = [
  ['CAM-TRUCK', 'Cam swap, truck (front of engine, lifters inspected)', 8.0, 'truck'],
  ['CAM-CAR', 'Cam swap, car (tighter engine bay)', 9.5, 'car'],
  ['DD-ADD', 'Deactivation delete, added to a cam swap', 1.5, 'all'],
  ['SPR-INST', 'Valve spring install and installed-height check', 2.0, 'all'],
  ['PTV-CHK', 'Piston-to-valve clearance check', 1.0, 'all'],
  ['TC-INST', 'Torque converter install', 4.5, 'all'],
  ['TUNE-LAB', 'Dyno tune session', 3.0, 'all'],
];

// Row ids follow each list's order (the first row is id 1); these find a row's id by its code.
const camId = (sku) => camRows.findIndex((r) => r[0] === sku) + 1;
const partId = (sku) => partRows.findIndex((r) => r[0] === sku) + 1;
const laborId = (code) => laborRows.findIndex((r) => r[0] === code) + 1;

function buildProfile({
  boreIn,
  strokeIn,
  rodLengthIn,
  compressionRatio,
  headMaterial,
  intakeFlowCfm,
  intakeManifold,
  cylinderDeactivation,
  headers,
  primaryIn,
  system,
  transmission,
  stallRpm,
  axleRatio,
  topGearRatio,
  tireDiameterIn,
  weightLb,
  powerBrakes,
  vehicleClass,
  primary,
  idle,
  fuelOctane,
  emissionsRequired,
  cruiseMph,
  budgetCents,
  baselineCam,
}) {
  return {
    engine: {
      cylinders: 8,
      boreIn,
      strokeIn,
      rodLengthIn,
      compressionRatio,
      headMaterial,
      intakeFlowCfm,
      intakeManifold,
      cylinderDeactivation,
    },
    exhaust: { headers, primaryIn, system },
    drivetrain: { transmission, stallRpm, axleRatio, topGearRatio, tireDiameterIn },
    vehicle: { weightLb, powerBrakes, class: vehicleClass },
    use: { primary, idle, fuelOctane, emissionsRequired, cruiseMph, budgetCents },
    baselineCam,
  };
}

function camCard(row, id) {
  const [sku, name, , in050, ex050, inAdv, exAdv, inLift, exLift, lsa, icl] = row;
  const card = {
    id: String(id),
    name: `${sku} ${name}`,
    intakeDuration050: in050,
    exhaustDuration050: ex050,
    intakeLiftIn: inLift,
    exhaustLiftIn: exLift,
    lsa,
    intakeCenterline: icl,
    rockerRatio: 1.7,
  };
  if (inAdv) card.intakeAdvertised = inAdv;
  if (exAdv) card.exhaustAdvertised = exAdv;
  // The springs fitted with that cam: the advisor's "needs springs" limit (a factory card states it).
  if (row[15]) card.springMaxLiftIn = row[15];
  return card;
}

// Each rule prices one kind of need the advisor names (it alone decides when a cam needs it), for one
// vehicle class or for every class without a rule of its own.
const needRules = [
  {
    id: 1,
    kind: 'install',
    vehicle_class: null,
    label: 'Cam install: trucks, SUVs and vans get the truck cam swap and the gasket set',
  },
  {
    id: 2,
    kind: 'install',
    vehicle_class: 'car',
    label: 'Cam install: cars get the car cam swap (tighter engine bay) and the gasket set',
  },
  {
    id: 3,
    kind: 'springs',
    vehicle_class: null,
    label: 'Past the installed springs’ limit: the spring kit rated for the lift, installed and checked',
  },
  { id: 4, kind: 'pushrods', vehicle_class: null, label: 'High lift or other rockers: hardened pushrods' },
  {
    id: 5,
    kind: 'lifters',
    vehicle_class: null,
    label: 'High lift on a stock valvetrain: non-deactivating lifters and trays',
  },
  {
    id: 6,
    kind: 'deactivation-delete',
    vehicle_class: null,
    label: 'Active deactivation and a non-compatible cam: the delete kit',
  },
  { id: 7, kind: 'converter', vehicle_class: null, label: 'Pulls well above the stall: a 2,800 converter, installed' },
  { id: 8, kind: 'tune', vehicle_class: null, label: 'Every cam swap gets a dyno tune' },
];

const customers = [
  {
    id: 1,
    name: 'Dana Whitlock',
    email: 'dana.whitlock@example.com',
    phone: '555-0171',
    notes: 'Tows a horse trailer most weekends.',
  },
  { id: 2, name: 'Marisol Okafor', email: 'marisol.okafor@example.com', phone: '555-0122', notes: null },
  {
    id: 3,
    name: 'Teddy Vranes',
    email: 'teddy.vranes@example.com',
    phone: '555-0193',
    notes: 'Weekend drag strip, street driven.',
  },
];

const baselineCard = (sku) => camCard(camRows[camId(sku) - 1], camId(sku));
const builds = [
  {
    id: 1,
    customer_id: 1,
    vehicle_label: '2011 full-size pickup, 5.3 L, crew cab',
    baseline_cam_id: camId('FB-53'),
    profile: buildProfile({
      boreIn: 3.78,
      strokeIn: 3.622,
      rodLengthIn: 6.098,
      compressionRatio: 9.9,
      headMaterial: 'aluminum',
      intakeFlowCfm: 240,
      intakeManifold: 'truck',
      cylinderDeactivation: 'active',
      headers: 'manifold',
      primaryIn: 1.625,
      system: 'full-with-cats',
      transmission: 'automatic',
      stallRpm: 2000,
      axleRatio: 3.73,
      topGearRatio: 0.67,
      tireDiameterIn: 31,
      weightLb: 5600,
      powerBrakes: 'vacuum',
      vehicleClass: 'truck',
      primary: 'towing',
      idle: 'smooth',
      fuelOctane: 87,
      emissionsRequired: false,
      cruiseMph: 65,
      budgetCents: 350000,
      baselineCam: baselineCard('FB-53'),
    }),
  },
  {
    id: 2,
    customer_id: 2,
    vehicle_label: '2006 regular-cab pickup, 6.0 L',
    baseline_cam_id: camId('FB-60'),
    profile: buildProfile({
      boreIn: 4.0,
      strokeIn: 3.622,
      rodLengthIn: 6.098,
      compressionRatio: 9.4,
      headMaterial: 'iron',
      intakeFlowCfm: 250,
      intakeManifold: 'truck',
      cylinderDeactivation: 'none',
      headers: 'long-tube',
      primaryIn: 1.75,
      system: 'full',
      transmission: 'automatic',
      stallRpm: 3000,
      axleRatio: 4.1,
      topGearRatio: 0.7,
      tireDiameterIn: 28,
      weightLb: 4300,
      powerBrakes: 'vacuum',
      vehicleClass: 'truck',
      primary: 'street',
      idle: 'noticeable',
      fuelOctane: 93,
      emissionsRequired: false,
      cruiseMph: 65,
      budgetCents: 450000,
      baselineCam: baselineCard('FB-60'),
    }),
  },
  {
    id: 3,
    customer_id: 3,
    vehicle_label: '2001 coupe, 5.7 L, manual',
    baseline_cam_id: camId('FB-57'),
    profile: buildProfile({
      boreIn: 3.898,
      strokeIn: 3.622,
      rodLengthIn: 6.098,
      compressionRatio: 10.2,
      headMaterial: 'aluminum',
      intakeFlowCfm: 265,
      intakeManifold: 'car',
      cylinderDeactivation: 'none',
      headers: 'long-tube',
      primaryIn: 1.875,
      system: 'full',
      transmission: 'manual',
      stallRpm: 0,
      axleRatio: 3.73,
      topGearRatio: 0.62,
      tireDiameterIn: 26,
      weightLb: 3500,
      powerBrakes: 'vacuum',
      vehicleClass: 'car',
      primary: 'strip',
      idle: 'aggressive',
      fuelOctane: 93,
      emissionsRequired: false,
      cruiseMph: 70,
      budgetCents: 300000,
      baselineCam: baselineCard('FB-57'),
    }),
  },
];

// The demo quotes' customer links (tokens) are the README's; only their hashes are stored.
const quotes = [
  {
    id: 1,
    number: 'Q-2026-0101',
    customer_id: 1,
    build_id: 1,
    cam: 'RB-198',
    status: 'sent',
    token: 'demo-quote-whitlock-link-2026',
    parts: ['GS-TC', 'SPR-600', 'TUNE-DYNO'],
    labor: ['CAM-TRUCK', 'SPR-INST', 'TUNE-LAB'],
  },
  {
    id: 2,
    number: 'Q-2026-0102',
    customer_id: 2,
    build_id: 2,
    cam: 'F9-219',
    status: 'deposit-paid',
    token: 'demo-quote-okafor-link-2026',
    parts: ['SPR-600', 'PR-7400', 'TS-DR', 'TUNE-DYNO', 'GS-TC'],
    labor: ['CAM-TRUCK', 'SPR-INST', 'PTV-CHK', 'TUNE-LAB'],
  },
  {
    id: 3,
    number: 'Q-2026-0103',
    customer_id: 3,
    build_id: 3,
    cam: 'LV-224',
    status: 'draft',
    token: null,
    parts: ['SPR-660', 'PR-7400', 'HW-TRUN', 'TUNE-DYNO', 'GS-TC'],
    labor: ['CAM-CAR', 'SPR-INST', 'PTV-CHK', 'TUNE-LAB'],
  },
];

module.exports = {
  async up(q) {
    const passwordHash = await argon2.hash(DEMO_PASSWORD, {
      type: argon2.argon2id,
      memoryCost: 19456,
      timeCost: 2,
      parallelism: 1,
    });

    await q.bulkInsert('shop_settings', [
      {
        id: 1,
        name: 'Tallgrass Valvetrain & Dyno',
        address: '418 Mill Race Road, Oxbow Bend',
        phone: '555-0148',
        email: 'counter@tallgrass-dyno.example',
        tax_rate_bp: 825,
        labor_rate_cents: 13500,
        deposit_percent_bp: 2000,
        deposit_min_cents: 20000,
        deposit_max_cents: 100000,
        deposit_policy_text:
          'Your deposit holds the parts and a bay for your job. It is refunded in full if you cancel at least 3 working days before the booked date, or if we cannot do the job as quoted. After parts are ordered specially for you, the cost of those parts is kept.',
        currency: 'usd',
        version: 1,
        ...stamp,
      },
    ]);

    await q.bulkInsert(
      'users',
      users.map((u) => ({ ...u, password_hash: passwordHash, active: true, version: 1, ...stamp })),
    );

    await q.bulkInsert(
      'suppliers',
      suppliers.map((s) => ({ ...s, ...stamp })),
    );

    await q.bulkInsert(
      'cams',
      camRows.map((r, i) => ({
        id: i + 1,
        sku: r[0],
        name: r[1],
        supplier_id: r[2],
        intake_duration_050: r[3],
        exhaust_duration_050: r[4],
        intake_advertised: r[5],
        exhaust_advertised: r[6],
        intake_lift_in: r[7],
        exhaust_lift_in: r[8],
        lsa: r[9],
        intake_centerline: r[10],
        rocker_ratio: 1.7,
        price_cents: r[11] * 100,
        cost_cents: Math.round(r[11] * 62),
        stock_on_hand: r[12],
        emissions_certified: r[13],
        deactivation_compatible: r[14],
        spring_max_lift_in: r[15],
        is_factory_baseline: r[0].startsWith('FB-'),
        baseline_for_liters: liters[r[0]] ?? null,
        active: true,
        archived_at: null,
        notes: r[16],
        version: 1,
        ...stamp,
      })),
    );

    await q.bulkInsert(
      'parts',
      partRows.map((r, i) => ({
        id: i + 1,
        sku: r[0],
        name: r[1],
        category: r[2],
        supplier_id: r[3],
        price_cents: r[4] * 100,
        cost_cents: r[5] * 100,
        stock_on_hand: r[6],
        spec: r[7] ? JSON.stringify(r[7]) : null,
        active: true,
        notes: null,
        version: 1,
        ...stamp,
      })),
    );

    await q.bulkInsert(
      'labor_operations',
      laborRows.map((r, i) => ({
        id: i + 1,
        code: r[0],
        name: r[1],
        hours: r[2],
        engines: r[3],
        active: true,
        version: 1,
        ...stamp,
      })),
    );

    await q.bulkInsert(
      'need_rules',
      needRules.map((r) => ({ ...r, threshold: null, active: true, version: 1, ...stamp })),
    );
    await q.bulkInsert(
      'need_rule_items',
      [
        { rule_id: 1, part_id: null, labor_operation_id: laborId('CAM-TRUCK'), quantity: 1 },
        { rule_id: 1, part_id: partId('GS-TC'), labor_operation_id: null, quantity: 1 },
        { rule_id: 2, part_id: null, labor_operation_id: laborId('CAM-CAR'), quantity: 1 },
        { rule_id: 2, part_id: partId('GS-TC'), labor_operation_id: null, quantity: 1 },
        { rule_id: 3, part_id: partId('SPR-600'), labor_operation_id: laborId('SPR-INST'), quantity: 1 },
        { rule_id: 4, part_id: partId('PR-7400'), labor_operation_id: null, quantity: 1 },
        { rule_id: 5, part_id: partId('LIF-16'), labor_operation_id: null, quantity: 1 },
        { rule_id: 5, part_id: partId('LIF-TRAY'), labor_operation_id: null, quantity: 1 },
        { rule_id: 6, part_id: partId('DD-KIT-53'), labor_operation_id: laborId('DD-ADD'), quantity: 1 },
        { rule_id: 7, part_id: partId('TC-2800'), labor_operation_id: laborId('TC-INST'), quantity: 1 },
        { rule_id: 8, part_id: partId('TUNE-DYNO'), labor_operation_id: laborId('TUNE-LAB'), quantity: 1 },
      ].map((r) => ({ ...r, ...stamp })),
    );

    await q.bulkInsert(
      'customers',
      customers.map((c) => ({ ...c, version: 1, ...stamp })),
    );

    await q.bulkInsert(
      'builds',
      builds.map((b) => ({
        ...b,
        profile: JSON.stringify(b.profile),
        profile_schema_version: 2,
        version: 1,
        ...stamp,
      })),
    );

    const priceOf = (sku) => partRows[partId(sku) - 1][4] * 100;
    const hoursOf = (code) => laborRows[laborId(code) - 1][2];
    const camPrice = (sku) => camRows[camId(sku) - 1][11] * 100;
    const laborRate = 13500;
    const quoteRows = [];
    const lineRows = [];
    for (const quote of quotes) {
      const lines = [
        {
          kind: 'cam',
          cam_id: camId(quote.cam),
          description: camRows[camId(quote.cam) - 1][1],
          quantity: 1,
          unit_price_cents: camPrice(quote.cam),
        },
        ...quote.parts.map((sku) => ({
          kind: sku.startsWith('TUNE') ? 'tune' : 'part',
          part_id: partId(sku),
          description: partRows[partId(sku) - 1][1],
          quantity: 1,
          unit_price_cents: priceOf(sku),
        })),
        ...quote.labor.map((code) => ({
          kind: 'labor',
          labor_operation_id: laborId(code),
          description: laborRows[laborId(code) - 1][1],
          quantity: hoursOf(code),
          unit_price_cents: laborRate,
        })),
      ].map((l, i) => ({
        cam_id: null,
        part_id: null,
        labor_operation_id: null,
        ...l,
        quote_id: quote.id,
        total_cents: Math.round(l.quantity * l.unit_price_cents),
        sort_order: i,
        ...stamp,
      }));
      const subtotal = lines.reduce((sum, l) => sum + l.total_cents, 0);
      const tax = Math.round((subtotal * 825) / 10000);
      const total = subtotal + tax;
      const deposit = Math.min(100000, Math.max(20000, Math.round(total * 0.2)));
      lineRows.push(...lines);
      quoteRows.push({
        id: quote.id,
        number: quote.number,
        customer_id: quote.customer_id,
        build_id: quote.build_id,
        cam_id: camId(quote.cam),
        created_by_user_id: 2,
        status: quote.status,
        public_token_hash: quote.token ? sha256(quote.token) : null,
        subtotal_cents: subtotal,
        tax_rate_bp: 825,
        tax_cents: tax,
        total_cents: total,
        deposit_cents: deposit,
        valid_until: validUntil,
        sent_at: quote.status === 'draft' ? null : now,
        accepted_at: quote.status === 'deposit-paid' ? now : null,
        version: 1,
        ...stamp,
      });
    }
    await q.bulkInsert('quotes', quoteRows);
    await q.bulkInsert('quote_lines', lineRows);
    const paid = quoteRows.find((r) => r.status === 'deposit-paid');
    await q.bulkInsert('payments', [
      {
        quote_id: paid.id,
        provider: 'stripe',
        provider_session_id: 'cs_test_demo_okafor',
        provider_payment_id: 'pi_test_demo_okafor',
        amount_cents: paid.deposit_cents,
        refunded_cents: 0,
        currency: 'usd',
        status: 'paid',
        paid_at: now,
        ...stamp,
      },
    ]);

    await q.bulkInsert('audit_log', [
      {
        user_id: null,
        actor: 'seed',
        action: 'demo.seeded',
        entity_type: null,
        entity_id: null,
        before: null,
        after: null,
        ip: null,
        created_at: now,
      },
    ]);
  },

  async down(q) {
    for (const table of [
      'audit_log',
      'payments',
      'quote_lines',
      'quotes',
      'dyno_runs',
      'interviews',
      'builds',
      'leads',
      'customers',
      'need_rule_items',
      'need_rules',
      'labor_operations',
      'parts',
      'cams',
      'suppliers',
      'users',
      'shop_settings',
    ]) {
      await q.bulkDelete(table, {});
    }
  },
  // Not used by sequelize-cli: the seeded rows, so tests name them (tests/support/demo.ts) instead of
  // repeating their ids.
  demo: {
    users,
    suppliers,
    camRows,
    partRows,
    laborRows,
    needRules,
    customers,
    builds,
    quotes,
    camId,
    partId,
    laborId,
  },
};
