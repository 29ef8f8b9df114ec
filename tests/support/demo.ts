// The seeded demo rows by name (database/seeders/*-demo-shop.js), so a test says DEMO.cams.bigTruck219
// instead of 13. Each id is looked up in the seeder's own lists with the seeder's own id rule, never
// retyped; tests/integration/demo-ids.test.ts checks every one against the database by its code or name,
// so a reseed that moves a row fails there, by name, instead of somewhere far away.

// A catalogue row as the seeder lists it: its code first.
type SeedRow = [string, ...unknown[]];
type DemoSeed = {
  users: { id: number; email: string }[];
  suppliers: { id: number; name: string }[];
  needRules: { id: number; kind: string; vehicle_class: string | null }[];
  customers: { id: number; email: string }[];
  builds: { id: number; customer_id: number; vehicle_label: string }[];
  quotes: { id: number; number: string }[];
  camRows: SeedRow[];
  partRows: SeedRow[];
  laborRows: SeedRow[];
  camId: (sku: string) => number;
  partId: (sku: string) => number;
  laborId: (code: string) => number;
};

// eslint-disable-next-line @typescript-eslint/no-require-imports
const seed = (require('../../database/seeders/20261202000100-demo-shop.js') as { demo: DemoSeed }).demo;

/** Each name's id, found by its key; a key the seed does not have stops every test at once, naming it. */
function idsOf<K extends string>(
  keys: Record<K, string>,
  find: (key: string) => number | undefined,
  what: string,
): Record<K, number> {
  return Object.fromEntries(
    Object.entries<string>(keys).map(([name, key]) => {
      const id = find(key);
      if (!id || id < 1)
        throw new Error(`tests/support/demo.ts: the demo seed has no ${what} ${key} (DEMO.${what}.${name})`);
      return [name, id];
    }),
  ) as Record<K, number>;
}

/** What names each row in the database: a cam's or part's sku, a labour code, an e-mail, a quote number. */
export const DEMO_KEYS = {
  users: { manager: 'manager@lobewise.test', counter: 'counter@lobewise.test', tech: 'tech@lobewise.test' },
  suppliers: {
    ridgeback: 'Ridgeback Grind Co.',
    lanternValley: 'Lantern Valley Cams',
    foundryNine: 'Foundry Nine Valvetrain',
    prairie: 'Prairie Drivetrain Supply',
  },
  cams: {
    factory48: 'FB-48',
    factory53: 'FB-53',
    factory57: 'FB-57',
    factory60: 'FB-60',
    factory62: 'FB-62',
    easyDaily194: 'F9-194', // mild, emissions-certified, deactivation-compatible
    towBoss198: 'RB-198', // on demo quote 1
    lowRise204: 'RB-204',
    hauler208: 'LV-208',
    towPlus210: 'RB-210',
    truckTorque212: 'LV-212',
    streetPull216: 'F9-216',
    bigTruck219: 'F9-219', // $439, lift 0.595", not deactivation-compatible; on demo quote 2
    grumbler220: 'RB-220',
    stripStreet224: 'LV-224', // on demo quote 3
    wideStreet226: 'LV-226',
    rowdy228: 'F9-228',
    bracket231: 'RB-231',
    fullSend235: 'LV-235',
  },
  parts: {
    springs570: 'SPR-570',
    ovateSprings600: 'SPR-600', // in the springs rule
    dualSprings660: 'SPR-660',
    pushrods7400: 'PR-7400', // in the pushrods rule
    pushrods7350: 'PR-7350',
    pushrodChecker: 'PR-CHK',
    lifterSet: 'LIF-16',
    lifterTrays: 'LIF-TRAY',
    deactivationDelete53: 'DD-KIT-53',
    deactivationDelete62: 'DD-KIT-62',
    deleteValleyCover: 'DD-COVER',
    singleRollerTiming: 'TS-SR',
    doubleRollerTiming: 'TS-DR', // on demo quote 2, in no rule
    chainTensioner: 'TS-TEN',
    camBolts: 'TS-BOLT',
    camRetainer: 'HW-RET',
    trunnionKit: 'HW-TRUN',
    breakInOil: 'HW-OIL',
    timingCoverGaskets: 'GS-TC', // in both install rules
    mainSeals: 'GS-SEAL',
    valveCoverGaskets: 'GS-VC',
    intakeGaskets: 'GS-INT',
    waterPumpGaskets: 'GS-WP',
    converter2400: 'TC-2400',
    converter2800: 'TC-2800',
    converter3200: 'TC-3200',
    dynoTune: 'TUNE-DYNO', // kind 'tune' on a quote
    tuneRevision: 'TUNE-REV',
  },
  labor: {
    camSwapTruck: 'CAM-TRUCK', // 8.0 h
    camSwapCar: 'CAM-CAR', // 9.5 h
    deactivationDelete: 'DD-ADD', // 1.5 h
    springInstall: 'SPR-INST', // 2.0 h
    ptvCheck: 'PTV-CHK', // 1.0 h
    converterInstall: 'TC-INST', // 4.5 h
    tuneSession: 'TUNE-LAB', // 3.0 h
  },
  // A rule is named by its kind and vehicle class ("kind" alone: every class without its own rule).
  needRules: {
    install: 'install',
    carInstall: 'install/car',
    springs: 'springs',
    pushrods: 'pushrods',
    lifters: 'lifters',
    deactivationDelete: 'deactivation-delete',
    converter: 'converter',
    tune: 'tune',
  },
  customers: {
    whitlock: 'dana.whitlock@example.com',
    okafor: 'marisol.okafor@example.com',
    vranes: 'teddy.vranes@example.com',
  },
  // A build is named by its customer's e-mail: each demo customer has one.
  builds: {
    whitlockTowingTruck: 'dana.whitlock@example.com', // 5.3 L, active deactivation, 2,000 stall, towing
    okaforStreetTruck: 'marisol.okafor@example.com', // 6.0 L, 3,000 stall; its quote's deposit is paid (a job)
    vranesStripCoupe: 'teddy.vranes@example.com', // 5.7 L car, manual
  },
  quotes: { whitlockSent: 'Q-2026-0101', okaforDepositPaid: 'Q-2026-0102', vranesDraft: 'Q-2026-0103' },
} as const;

const customerId = (email: string) => seed.customers.find((c) => c.email === email)?.id;

export const DEMO = {
  users: idsOf(DEMO_KEYS.users, (email) => seed.users.find((u) => u.email === email)?.id, 'users'),
  suppliers: idsOf(DEMO_KEYS.suppliers, (name) => seed.suppliers.find((s) => s.name === name)?.id, 'suppliers'),
  cams: idsOf(DEMO_KEYS.cams, seed.camId, 'cams'),
  parts: idsOf(DEMO_KEYS.parts, seed.partId, 'parts'),
  labor: idsOf(DEMO_KEYS.labor, seed.laborId, 'labor'),
  needRules: idsOf(
    DEMO_KEYS.needRules,
    (key) => seed.needRules.find((r) => `${r.kind}${r.vehicle_class ? `/${r.vehicle_class}` : ''}` === key)?.id,
    'needRules',
  ),
  customers: idsOf(DEMO_KEYS.customers, customerId, 'customers'),
  builds: idsOf(
    DEMO_KEYS.builds,
    (email) => seed.builds.find((b) => b.customer_id === customerId(email))?.id,
    'builds',
  ),
  quotes: idsOf(DEMO_KEYS.quotes, (number) => seed.quotes.find((q) => q.number === number)?.id, 'quotes'),
};

/** An id no seeded or test-made row will reach: for "not found" answers. */
export const MISSING_ID = 999_999;
