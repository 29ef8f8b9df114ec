import { rankCams } from '@/lib/advisor';
import { PLAIN_CAUTION } from '@/lib/leads/shortlist';
import { comparisonGroups, vacuumWords, type ComparedCam } from '@/lib/shortlist/comparison';
import { customerCam, customerCamName } from '@/lib/shortlist/customer-words';
import { bigCam, dynoBuild, truckCam } from './fixtures';

// The side-by-side comparison and the customer's words read the ranking's own numbers; these check that
// the figures come through as the cam card and the advisor gave them, and that only customer-safe fields
// leave customerCam().
const ranking = rankCams(dynoBuild, [truckCam, bigCam]);
const byId = (id: string) => ranking.rankings.find((r) => r.camId === id)!;
const compared = (id: string, jobPriceCents: number | null, emissionsCertified = false): ComparedCam => ({
  ...byId(id),
  jobPriceCents,
  emissionsCertified,
});
const rowsOf = (cams: ComparedCam[]) =>
  Object.fromEntries(
    comparisonGroups(cams)
      .flatMap((g) => g.rows)
      .map((r) => [r.key, r.values]),
  );

describe('cam comparison (the ranking’s own figures, in words and units)', () => {
  it('carries each cam card’s figures in the ranking, without its price', () => {
    const truck = byId('truck-212');
    expect(truck.specs).toEqual({
      intakeDuration050: 212,
      exhaustDuration050: 218,
      intakeLiftIn: 0.565,
      exhaustLiftIn: 0.565,
      lsa: 113,
      intakeCenterline: 109,
      rockerRatio: 1.7,
    });
    expect('priceCents' in truck.specs).toBe(false);
  });

  it('puts the cards, the valve events, the advisor’s compression and vacuum and the job price side by side', () => {
    const truck = compared('truck-212', 301250, true);
    const big = compared('big-219', null);
    const rows = rowsOf([truck, big]);
    expect(rows.duration).toEqual(['212° / 218°', '219° / 225°']);
    expect(rows.lift).toEqual(['0.565" / 0.565"', '0.595" / 0.595"']);
    expect(rows.lsa).toEqual(['113°', '113°']);
    expect(rows.icl).toEqual(['109°', '109°']);
    // Cam-card arithmetic (common practice): 212° at 109° ICL opens the intake 212/2 − 109 = −3°, i.e. 3° after TDC.
    expect(truck.valveEvents.ivo).toBeCloseTo(-3, 5);
    expect(rows.ivo[0]).toBe('3° after TDC');
    expect(rows.ivc[0]).toBe(`${truck.valveEvents.ivc}° after BDC`);
    expect(truck.valveEvents.overlap).toBeLessThan(0);
    expect(rows.overlap[0]).toBe(`None at 0.050" (−${-truck.valveEvents.overlap}°)`);
    expect(rows.dcr).toEqual([`${truck.dynamicCompression.toFixed(1)}:1`, `${big.dynamicCompression.toFixed(1)}:1`]);
    expect(rows.vacuum[0]).toContain(`About ${Math.round(truck.idleVacuumInHg)} inHg`);
    expect(rows.price).toEqual(['$3,012.50', 'Price at the counter']);
    expect(rows.emissions).toEqual([
      'Certified for emissions-tested road use',
      'Not certified for emissions-tested road use',
    ]);
    for (const values of Object.values(rows)) expect(values).toHaveLength(2);
  });

  it('says whether idle vacuum is enough for vacuum power brakes (about 15 inHg, common practice)', () => {
    expect(vacuumWords(16.2)).toBe('About 16 inHg: enough for vacuum power brakes');
    expect(vacuumWords(12.4)).toBe('About 12 inHg: less than the 15 inHg or so vacuum power brakes want');
    expect(vacuumWords(14.6)).toBe('About 14.6 inHg: less than the 15 inHg or so vacuum power brakes want');
  });
});

describe('customer words for a chosen cam', () => {
  it('copies out only what a customer may see, with the same job price text as the comparison', () => {
    const big = compared('big-219', 287400);
    const told = customerCam(big);
    expect(Object.keys(told).sort()).toEqual(['camId', 'does', 'includes', 'jobPrice', 'knowFirst', 'name']);
    expect(told.jobPrice).toBe(rowsOf([big]).price[0]);
    expect(told.does).toHaveLength(4);
    expect(told.includes).toHaveLength(big.needs.length);
    // Not certified: its own emissions caution; the valvetrain and tune cautions are listed once for the whole view.
    expect(told.knowFirst).toContain(PLAIN_CAUTION.emissions);
    expect(told.knowFirst).not.toContain(PLAIN_CAUTION.valvetrain);
    expect(JSON.stringify(told)).not.toMatch(/score|\/100|subscore/i);
  });

  it('names a catalogue cam by its grind, without the shop’s SKU (a card given whole keeps its name)', () => {
    expect(customerCamName({ camId: 14, camName: 'F9-216 Street pull grind' })).toBe('Street pull grind');
    expect(customerCamName({ camId: 'truck-212', camName: 'Invented truck grind 212' })).toBe(
      'Invented truck grind 212',
    );
  });
});
