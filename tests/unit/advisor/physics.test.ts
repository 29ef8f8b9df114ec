import {
  crankToPinDistanceIn,
  cruiseRpm,
  displacementCi,
  dynamicCompression,
  dynamicCompressionRatio,
  horsepower,
  litresFromCubicInches,
  meanPistonSpeedFtMin,
  pistonTravelFromTdcIn,
  predictCurve,
  valveEvents,
} from '@/lib/advisor';
import { cam, dynoBuild, bigCam, truckCam, variant } from './fixtures';
import { crossoverRpm, TIE_FRACTION } from '@/lib/advisor/crossover';

describe('horsepower', () => {
  it('hp = torque · rpm / 5252 (definition of horsepower, 33,000 ft·lbf/min)', () => {
    // 33,000 / 2π = 5,252.1: at 5,252 rpm torque and horsepower are the same number.
    expect(horsepower(400, 5252)).toBe(400);
    expect(horsepower(300, 2626)).toBe(150);
  });

  it('holds exactly on every point of every predicted curve (definition of horsepower)', () => {
    for (const c of [dynoBuild.baselineCam, truckCam, bigCam]) {
      const { curve } = predictCurve(dynoBuild, c);
      expect(curve.length).toBeGreaterThan(50);
      for (const p of curve) expect(p.hp).toBe((p.torqueLbFt * p.rpm) / 5252);
    }
  });

  it('curves run 1,500–7,000 rpm in 100-rpm steps, cut at 4,500 ft/min piston speed (Heywood ch. 2; limit common practice, from memory)', () => {
    const rpms = predictCurve(dynoBuild, truckCam).curve.map((p) => p.rpm);
    expect(rpms[0]).toBe(1500);
    expect(rpms[rpms.length - 1]).toBe(7000);
    expect(rpms.every((r, i) => i === 0 || r - rpms[i - 1] === 100)).toBe(true);
    // A 4.5" stroke reaches 4,500 ft/min at 4,500 · 12 / (2 · 4.5) = 6,000 rpm (arithmetic).
    const longStroke = variant({ engine: { strokeIn: 4.5, rodLengthIn: 6.8 } });
    const top = predictCurve(longStroke, truckCam).curve.at(-1);
    expect(top?.rpm).toBe(6000);
  });
});

describe('geometry', () => {
  it('3.780" × 3.622" × 8 ≈ 325 in³ = 5.3 L (arithmetic; bore and stroke are the maker\'s published specs, from memory)', () => {
    // π/4 · 3.78² · 3.622 · 8 = 0.7854 · 14.2884 · 28.976 = 325.2 in³; / 61.024 = 5.33 L.
    expect(displacementCi(3.78, 3.622, 8)).toBeCloseTo(325.2, 1);
    expect(litresFromCubicInches(displacementCi(3.78, 3.622, 8))).toBeCloseTo(5.33, 2);
  });

  it('3.900" × 3.622" × 8 ≈ 346 in³ = 5.7 L (arithmetic; published specs, from memory)', () => {
    // π/4 · 3.9² · 3.622 · 8 = 0.7854 · 15.21 · 28.976 = 346.1 in³; / 61.024 = 5.67 L.
    expect(displacementCi(3.9, 3.622, 8)).toBeCloseTo(346.1, 1);
    expect(litresFromCubicInches(displacementCi(3.9, 3.622, 8))).toBeCloseTo(5.67, 2);
  });

  it('slider-crank puts the piston a full stroke apart at TDC and BDC (Heywood ch. 2)', () => {
    // s(0) = a + l, s(180) = l − a, so the travel between them is 2a = the stroke.
    expect(crankToPinDistanceIn(3.622, 6.098, 0)).toBeCloseTo(6.098 + 1.811, 12);
    expect(pistonTravelFromTdcIn(3.622, 6.098, 180)).toBeCloseTo(3.622, 12);
    expect(pistonTravelFromTdcIn(3.622, 6.098, 0)).toBeCloseTo(0, 12);
    // At 90° the piston is past half stroke because the rod is angled (Heywood ch. 2):
    // travel = l + a − √(l² − a²) = 6.098 + 1.811 − √(37.1856 − 3.2797) = 7.909 − 5.8229 = 2.086".
    expect(pistonTravelFromTdcIn(3.622, 6.098, 90)).toBeCloseTo(2.086, 3);
  });

  it('mean piston speed = 2 · stroke · rpm (Heywood ch. 2)', () => {
    // 2 · 3.622 in · 6,000 rpm / 12 in per ft = 3,622 ft/min (arithmetic).
    expect(meanPistonSpeedFtMin(3.622, 6000)).toBeCloseTo(3622, 9);
  });
});

describe('valve events', () => {
  it('220°/230° at 0.050", LSA 112°, ICL 108° (standard cam-card arithmetic, hand-worked example)', () => {
    // IVO = 220/2 − 108 = 2° BTDC; IVC = 220/2 + 108 − 180 = 38° ABDC.
    // ECL = 2 · 112 − 108 = 116°; EVO = 230/2 + 116 − 180 = 51° BBDC; EVC = 230/2 − 116 = −1° ATDC.
    // Overlap = IVO + EVC = 2 + (−1) = 1°.
    const e = valveEvents(
      cam({
        id: 1,
        name: 'hand example',
        intakeDuration050: 220,
        exhaustDuration050: 230,
        intakeLiftIn: 0.58,
        exhaustLiftIn: 0.58,
        lsa: 112,
        intakeCenterline: 108,
      }),
    );
    expect(Math.abs(e.ivo - 2)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(e.ivc - 38)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(e.exhaustCenterline - 116)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(e.evo - 51)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(e.evc - -1)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(e.overlap - 1)).toBeLessThanOrEqual(0.5);
    expect(e.advertised).toBeUndefined();
  });

  it('gives the advertised events when the card has both advertised durations (hand-worked example)', () => {
    // 272°/282°, LSA 112, ICL 108: IVO = 136 − 108 = 28; IVC = 136 + 108 − 180 = 64;
    // EVO = 141 + 116 − 180 = 77; EVC = 141 − 116 = 25; overlap = 53.
    const e = valveEvents(
      cam({
        id: 2,
        name: 'adv example',
        intakeDuration050: 220,
        exhaustDuration050: 230,
        intakeAdvertised: 272,
        exhaustAdvertised: 282,
        intakeLiftIn: 0.58,
        exhaustLiftIn: 0.58,
        lsa: 112,
        intakeCenterline: 108,
      }),
    );
    expect(e.advertised).toEqual({ ivo: 28, ivc: 64, evo: 77, evc: 25, overlap: 53 });
  });
});

describe('dynamic compression', () => {
  it('slider-crank example: 3.622" stroke, 6.098" rod, 10.0:1, IVC 50° ABDC → 8.79:1 (Heywood ch. 2, hand-worked)', () => {
    // θ = 180 + 50 = 230° from TDC; a = 1.811; cos 230° = −0.64279, sin 230° = −0.76604.
    // s = a·cosθ + √(l² − a²·sin²θ) = −1.16409 + √(37.18560 − 1.92462) = −1.16409 + 5.93810 = 4.77401.
    // Travel left after IVC = l + a − s = 6.098 + 1.811 − 4.77401 = 3.13499" (of 3.622").
    // DCR = 1 + (3.13499 / 3.622) · (10 − 1) = 1 + 0.86554 · 9 = 8.790.
    expect(Math.abs(dynamicCompressionRatio(3.622, 6.098, 10.0, 50) - 8.79)).toBeLessThanOrEqual(0.05);
  });

  it('equals the static ratio when the intake closes at BDC (arithmetic)', () => {
    expect(dynamicCompressionRatio(3.622, 6.098, 10.0, 0)).toBeCloseTo(10.0, 9);
  });

  it('uses the advertised IVC when given, else 0.050" IVC + 26° (half the 52° hydraulic-roller ramp the lift curves use; from memory)', () => {
    // 0.050" IVC = 220/2 + 108 − 180 = 38°, + 26° = 64°; advertised 276°: 138 + 108 − 180 = 66°.
    const base = {
      id: 3,
      name: 'x',
      intakeDuration050: 220,
      exhaustDuration050: 226,
      intakeLiftIn: 0.58,
      exhaustLiftIn: 0.58,
      lsa: 112,
      intakeCenterline: 108,
    };
    const b = variant({ engine: { compressionRatio: 10 } });
    expect(dynamicCompression(b, cam(base))).toBeCloseTo(dynamicCompressionRatio(3.622, 6.098, 10, 64), 9);
    expect(dynamicCompression(b, cam({ ...base, intakeAdvertised: 276 }))).toBeCloseTo(
      dynamicCompressionRatio(3.622, 6.098, 10, 66),
      9,
    );
    // A later-closing intake traps less charge: lower DCR (Heywood ch. 2).
    expect(dynamicCompressionRatio(3.622, 6.098, 10, 66)).toBeLessThan(dynamicCompressionRatio(3.622, 6.098, 10, 64));
  });
});

describe('cruise rpm', () => {
  it('70 mph, 3.73 axle, 0.70 top gear, 31" tyre → about 1,982 rpm (336.13 = 63,360 / 60π, hand-worked)', () => {
    // 70 · 3.73 = 261.1; · 0.70 = 182.77; · 336.13 = 61,434.5; / 31 = 1,981.8 rpm.
    expect(cruiseRpm(70, 3.73, 0.7, 31)).toBeCloseTo(1981.8, 1);
    // The constant itself: 63,360 in per mile / (60 · π) = 336.135 (arithmetic).
    expect(Math.abs(63360 / (60 * Math.PI) - 336.13)).toBeLessThan(0.01);
  });
});

describe('crossover ties (numerical resolution of the cycle model)', () => {
  const rpms = [3000, 3500, 4000, 4500, 5000, 5500];
  const stock = [433, 439, 440, 434, 420, 390];
  it('a dip smaller than TIE_FRACTION does not end the lead', () => {
    const cam = [426, 451, 452, 444, 419, 406]; // 1 lb·ft behind at 5,000 rpm
    const x = crossoverRpm(rpms, cam, stock)!;
    expect(x).toBeGreaterThan(3000);
    expect(x).toBeLessThan(3500);
  });
  it('a real shortfall still ends it', () => {
    const cam = [426, 451, 452, 444, 400, 406]; // 20 lb·ft behind at 5,000 rpm
    expect(crossoverRpm(rpms, cam, stock)).toBeGreaterThan(5000);
  });
  it('a tie alone is no lead: level with the current cam at the top is null', () => {
    expect(
      crossoverRpm(
        rpms,
        stock.map((t) => t - 1),
        stock,
      ),
    ).toBeNull();
    expect(TIE_FRACTION).toBeLessThan(0.01);
  });
});
