import { canSeeCosts, withoutCosts } from '@/lib/auth/costs';
import { POLICY } from '@/lib/auth/policy';

// Cost hiding decides from the `costs.read` row of the permission table, for every caller.
describe('cost visibility', () => {
  it('follows the costs.read row: managers and counter staff see costs, technicians and nobody else do not', () => {
    expect(POLICY['costs.read']).toEqual(['manager', 'counter']);
    expect(canSeeCosts({ role: 'manager' })).toBe(true);
    expect(canSeeCosts({ role: 'counter' })).toBe(true);
    expect(canSeeCosts({ role: 'tech' })).toBe(false);
    expect(canSeeCosts(null)).toBe(false);
  });

  it('drops costCents for a technician and keeps every other field', () => {
    const part = { id: 4, name: 'Pushrod set', priceCents: 12_900, costCents: 7_100 };
    expect(withoutCosts(part, { role: 'tech' })).toEqual({ id: 4, name: 'Pushrod set', priceCents: 12_900 });
    expect(withoutCosts(part, { role: 'counter' })).toEqual(part);
  });
});
