import { BuildProfileSchema, vehicleClassOf } from '@/lib/schemas/build-profile';
import { BUILD_RECORD_LIMITS } from '@/lib/schemas/build';
import { dynoInput } from '../advisor/fixtures';

// The stored-profile rewrite of migration 20261205000410: schema 1 → 2 adds vehicle.class and keeps every
// other field, under its old name, exactly as stored.
// eslint-disable-next-line @typescript-eslint/no-require-imports -- a sequelize-cli migration is CommonJS
const migration = require('../../../database/migrations/20261205000410-needs-by-kind-and-vehicle-class.js') as {
  profileToV2: (label: string, stored: unknown) => Record<string, Record<string, unknown>>;
  profileToV1: (stored: unknown) => Record<string, Record<string, unknown>>;
};

const v1 = JSON.parse(JSON.stringify(dynoInput)) as Record<string, Record<string, unknown>>;

describe('build profile schema 2', () => {
  it('is the version new builds are stamped with', () => {
    expect(BUILD_RECORD_LIMITS.profileSchemaVersion).toBe(2);
  });

  it('fills vehicle.class from the label’s words, else from the intake, and keeps every other field', () => {
    const cases: [string, string][] = [
      ['2011 full-size pickup, 5.3 L, crew cab', 'truck'],
      ['2008 SUV, 5.3 L', 'suv'],
      ['Cargo van 6.0 L', 'van'],
      ['2001 coupe, 5.7 L, manual', 'car'],
      ['customer’s 5.3 L', 'truck'],
    ];
    for (const [label, want] of cases) {
      const v2 = migration.profileToV2(label, JSON.stringify(v1));
      expect(v2.vehicle.class).toBe(want);
      expect({ ...v2, vehicle: { ...v2.vehicle, class: undefined } }).toEqual({
        ...v1,
        vehicle: { ...v1.vehicle, class: undefined },
      });
      expect(BuildProfileSchema.safeParse(v2).success).toBe(true);
    }
    const carIntake = { ...v1, engine: { ...v1.engine, intakeManifold: 'car' } };
    expect(migration.profileToV2('5.7 L', carIntake).vehicle.class).toBe('car');
  });

  it('leaves a class already given alone, and down takes it out again', () => {
    const given = { ...v1, vehicle: { ...v1.vehicle, class: 'van' } };
    expect(migration.profileToV2('2011 pickup', given).vehicle.class).toBe('van');
    expect(migration.profileToV1(given)).toEqual(v1);
  });

  it('a profile without a class still reads, and the default is the one the migration would pick', () => {
    const parsed = BuildProfileSchema.parse(v1);
    expect(parsed.vehicle.class).toBeUndefined();
    expect(vehicleClassOf(parsed)).toBe(migration.profileToV2('no words', v1).vehicle.class);
  });
});
