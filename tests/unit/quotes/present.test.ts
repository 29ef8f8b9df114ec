import { POLICY } from '@/lib/auth/policy';
import { ALL_STAFF, type SessionUser } from '@/lib/auth/roles';
import { presentQuote } from '@/lib/quotes/present';
import type { QuoteRecord } from '@/lib/quotes/types';

// Cost hiding on a quote (src/lib/quotes/present.ts) follows the `costs.read` row of the permission table.

const line = {
  id: 1,
  kind: 'cam' as const,
  camId: 7,
  partId: null,
  laborOperationId: null,
  description: 'Invented grind',
  quantity: 1,
  unitPriceCents: 50_000,
  discountCents: 0,
  totalCents: 50_000,
  sortOrder: 0,
  unitCostCents: 30_000,
};
// Only the fields presentation touches matter here; the rest of the record passes through untouched.
const record = {
  id: 9,
  number: 'Q-TEST-0009',
  lines: [line],
  costCents: 30_000,
  marginCents: 20_000,
} as unknown as QuoteRecord;
const staff = (role: SessionUser['role']): SessionUser => ({ id: 1, email: `${role}@example.com`, name: role, role });

describe('presentQuote', () => {
  it.each(ALL_STAFF)('shows %s the costs exactly when the table gives the role costs.read', (role) => {
    const shown = presentQuote(record, staff(role));
    const mayRead = (POLICY['costs.read'] as readonly string[]).includes(role);
    expect('costCents' in shown).toBe(mayRead);
    expect('marginCents' in shown).toBe(mayRead);
    expect('unitCostCents' in shown.lines[0]).toBe(mayRead);
    expect(shown.lines[0].totalCents).toBe(50_000);
    expect(shown.number).toBe('Q-TEST-0009');
  });

  it('hides costs from a technician', () => {
    const shown = presentQuote(record, staff('tech'));
    expect(shown.costCents).toBeUndefined();
    expect(shown.lines[0].unitCostCents).toBeUndefined();
  });
});
