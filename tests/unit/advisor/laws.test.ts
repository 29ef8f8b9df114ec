import { predictCurve } from '@/lib/advisor';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { build, cam, stockTruckCam } from './fixtures';

// Laws the engine-cycle model must obey on engines it was not fitted to. Sources: Heywood, ICE
// Fundamentals (1988) where named; otherwise common practice of the trade, no published source.
// Bore × stroke of the common engines are the makers' published specs, from memory.

const truck = (
  p: {
    bore?: number;
    stroke?: number;
    cfm?: number;
    cr?: number;
    headers?: 'manifold' | 'shorty' | 'long-tube';
    system?: 'full' | 'full-with-cats' | 'open-short';
    octane?: number;
  } = {},
): BuildProfile =>
  build({
    engine: {
      cylinders: 8,
      boreIn: p.bore ?? 3.78,
      strokeIn: p.stroke ?? 3.622,
      rodLengthIn: (p.stroke ?? 3.622) < 3.5 ? 6.275 : 6.098,
      compressionRatio: p.cr ?? 9.9,
      headMaterial: 'aluminum',
      intakeFlowCfm: p.cfm ?? 240,
      intakeManifold: 'truck',
      cylinderDeactivation: 'none',
    },
    exhaust: { headers: p.headers ?? 'manifold', primaryIn: 1.75, system: p.system ?? 'full-with-cats' },
    drivetrain: { transmission: 'automatic', stallRpm: 2200, axleRatio: 3.42, topGearRatio: 0.7, tireDiameterIn: 30 },
    vehicle: { weightLb: 5000, powerBrakes: 'vacuum' },
    use: {
      primary: 'daily',
      idle: 'smooth',
      fuelOctane: p.octane ?? 87,
      emissionsRequired: false,
      cruiseMph: 65,
      budgetCents: 300000,
    },
    baselineCam: stockTruckCam,
  });
const grind = (durIn: number, lift = 0.56, lsa = 112, icl = lsa - 4, exDur = durIn + 6): CamCard =>
  cam({
    id: `g${durIn}`,
    name: `grind ${durIn}`,
    intakeDuration050: durIn,
    exhaustDuration050: exDur,
    intakeLiftIn: lift,
    exhaustLiftIn: lift,
    lsa,
    intakeCenterline: icl,
  });
const at = (r: ReturnType<typeof predictCurve>, rpm: number) => r.curve.find((p) => p.rpm === rpm)!.torqueLbFt;
const displacementCi = (b: BuildProfile) =>
  (Math.PI / 4) * b.engine.boreIn ** 2 * b.engine.strokeIn * b.engine.cylinders;
// Four-stroke: BMEP (psi) = 150.8 · lb·ft / in³ (4π · 12 in/ft).
const bmepPsi = (b: BuildProfile, lbFt: number) => (150.8 * lbFt) / displacementCi(b);

const L48 = { bore: 3.78, stroke: 3.267 };
const L53 = { bore: 3.78, stroke: 3.622 };
const L60 = { bore: 4.0, stroke: 3.622 };
const L62 = { bore: 4.065, stroke: 3.622 };

describe('laws of the engine model', () => {
  it('same heads and cam: more displacement, more torque (4.8 < 5.3 < 6.0 < 6.2 L)', () => {
    const t = [L48, L53, L60, L62].map((e) => predictCurve(truck(e), stockTruckCam).predicted.peakTorqueLbFt);
    for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
  });

  it('peak BMEP stays within what two-valve pump-gas engines reach (about 195–215 psi at most; common practice)', () => {
    for (const b of [
      truck(L48),
      truck({ ...L53, cfm: 320, headers: 'long-tube', system: 'open-short', cr: 11, octane: 93 }),
      truck({ ...L48, cfm: 350, cr: 12, octane: 93 }),
    ]) {
      for (const c of [stockTruckCam, grind(212, 0.565, 113), grind(220, 0.6, 106, 104)]) {
        const r = predictCurve(b, c);
        expect(bmepPsi(b, r.predicted.peakTorqueLbFt)).toBeLessThanOrEqual(215);
        expect(bmepPsi(b, r.predicted.peakTorqueLbFt)).toBeGreaterThan(150);
      }
    }
  });

  it('more head flow moves the power peak up and raises the top end; the low end barely moves', () => {
    const small = predictCurve(truck({ cfm: 240 }), stockTruckCam);
    const big = predictCurve(truck({ cfm: 320 }), stockTruckCam);
    expect(big.predicted.peakHpRpm).toBeGreaterThan(small.predicted.peakHpRpm);
    expect(big.predicted.peakHp).toBeGreaterThan(small.predicted.peakHp * 1.05);
    expect(Math.abs(at(big, 2000) / at(small, 2000) - 1)).toBeLessThan(0.03);
  });

  it('a stock engine with a full exhaust makes at least about 80 % of its peak torque at 2,000 rpm (from memory: 80–85 %)', () => {
    for (const e of [L48, L53, L60])
      for (const system of ['full', 'full-with-cats'] as const) {
        const r = predictCurve(truck({ ...e, system }), stockTruckCam);
        expect(at(r, 2000) / r.predicted.peakTorqueLbFt).toBeGreaterThanOrEqual(0.8);
        expect(at(r, 1500)).toBeGreaterThan(0);
      }
  });

  it('advancing the installed centerline adds low end (common practice)', () => {
    const b = truck();
    const advanced = predictCurve(b, grind(212, 0.565, 113, 105));
    const retarded = predictCurve(b, grind(212, 0.565, 113, 113));
    expect(at(advanced, 1500)).toBeGreaterThan(at(retarded, 1500));
    expect(at(advanced, 2000)).toBeGreaterThan(at(retarded, 2000));
  });

  it('the crossover falls as displacement grows (a cam acts smaller in a bigger engine)', () => {
    for (const d of [212, 219, 228]) {
      const x = (e: { bore: number; stroke: number }) =>
        predictCurve(truck({ ...e, headers: 'long-tube', system: 'full' }), grind(d, 0.45 + (d - 190) * 0.005))
          .crossoverRpm as number;
      expect(x(L62)).toBeLessThan(x(L53));
      expect(x(L62)).toBeLessThan(x(L48));
    }
  });

  it('the crossover rises with intake duration', () => {
    for (const e of [L48, L62]) {
      const xs = [208, 218, 228].map(
        (d) =>
          predictCurve(truck({ ...e, headers: 'long-tube', system: 'full' }), grind(d, 0.45 + (d - 190) * 0.005))
            .crossoverRpm as number,
      );
      expect(xs[1]).toBeGreaterThan(xs[0]);
      expect(xs[2]).toBeGreaterThan(xs[1]);
    }
  });

  it('hp = lb·ft · rpm / 5252 on every point (definition of horsepower)', () => {
    for (const p of predictCurve(truck(), grind(220)).curve) expect(p.hp).toBe((p.torqueLbFt * p.rpm) / 5252);
  });
});
