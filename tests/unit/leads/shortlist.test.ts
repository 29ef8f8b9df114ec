import type { ShopRanking } from '@/lib/ranking/types';
import { shortlistForCustomer, shortlistFrom } from '@/lib/leads/shortlist';
import type { LeadAnswers } from '@/lib/schemas/lead';

// The customer's shortlist honours emissions: a vehicle that must pass never sees a cam that is not
// certified, however well the advisor ranked it; the choices are renumbered as shown.
const answers: LeadAnswers = {
  engine: '5.3',
  use: 'daily',
  idle: 'smooth',
  emissions: 'yes',
  transmission: 'automatic',
  driveline: 'stock',
  exhaust: 'stock',
  budget: 'unsure',
  name: 'Test Customer',
  email: 'test@example.com',
  phone: undefined,
  consent: true,
};

/** Only the fields the shortlist reads; the advisor's full entry has many more. */
function entry(camId: number, rank: number) {
  return {
    camId,
    rank,
    camName: `Cam ${camId}`,
    crossoverRpm: null,
    idleVacuumInHg: 17,
    needs: [],
    cautions: [],
    predicted: { gainPctPeakHp: 10 - rank, lowEndLossPct: 0 },
    camPriceCents: 40_000,
    neededItemsCents: 10_000,
  };
}
const ranking = {
  notice: 'indicative',
  rankings: [1, 2, 3, 4, 5].map((id, i) => entry(id, i + 1)),
} as unknown as ShopRanking;
// Cams 2 and 4 are the certified ones.
const certified = (id: string | number) => id === 2 || id === 4;

describe('the questionnaire shortlist and emissions', () => {
  it('leaves out every cam that is not certified when the vehicle must pass, and numbers the rest 1, 2', () => {
    const list = shortlistFrom(ranking, answers, 5.3, true, certified);
    expect(list.entries.map((e) => [e.rank, e.camId])).toEqual([
      [1, 2],
      [2, 4],
    ]);
    expect(list.entries.every((e) => e.emissionsCertified)).toBe(true);
  });
  it('keeps the advisor’s top three when the vehicle does not have to pass', () => {
    const list = shortlistFrom(ranking, { ...answers, emissions: 'no' }, 5.3, false, certified);
    expect(list.entries.map((e) => e.camId)).toEqual([1, 2, 3]);
    expect(list.entries.map((e) => e.emissionsCertified)).toEqual([false, true, false]);
  });
  it('filters a shortlist stored before the rule for a customer who said yes or not sure, not for one who said no', () => {
    const stored = shortlistFrom(ranking, { ...answers, emissions: 'no' }, 5.3, false, certified);
    expect(shortlistForCustomer(stored, { emissions: 'yes' }).entries.map((e) => [e.rank, e.camId])).toEqual([[1, 2]]);
    expect(shortlistForCustomer(stored, { emissions: 'unsure' }).entries).toHaveLength(1);
    expect(shortlistForCustomer(stored, { emissions: 'no' })).toBe(stored);
  });
});
