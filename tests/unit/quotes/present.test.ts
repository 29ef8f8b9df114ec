import { POLICY } from '@/lib/auth/policy';
import { ALL_STAFF, type SessionUser } from '@/lib/auth/roles';
import { customerQuote, presentQuote } from '@/lib/quotes/present';
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

describe('customerQuote', () => {
  const payment = (id: number, status: string, duplicateOfPaymentId: number | null = null) => ({
    id,
    status,
    duplicateOfPaymentId,
    amountCents: 20_000,
    providerSessionId: `cs_invented_${id}`,
    providerPaymentId: `pi_invented_${id}`,
    recordedBy: { id: 3, name: 'Invented Staff' },
  });
  const full = {
    ...record,
    discountApproval: { state: 'approved', discountBp: 500, approvedBy: { id: 1, name: 'Invented Manager' } },
    payments: [payment(1, 'paid'), payment(2, 'pending'), payment(3, 'paid', 1)],
  } as unknown as QuoteRecord;

  it('shows the customer the money taken, without provider ids, staff names or costs', () => {
    const shown = customerQuote(full);
    expect(shown.payments.map((p) => p.id)).toEqual([1]);
    expect(shown.payments[0]).toMatchObject({ providerSessionId: null, providerPaymentId: null, recordedBy: null });
    expect(shown.payments[0].amountCents).toBe(20_000);
    expect(shown.discountApproval.approvedBy).toBeNull();
    expect(shown.discountApproval.discountBp).toBe(500);
    expect('costCents' in shown).toBe(false);
    expect('unitCostCents' in shown.lines[0]).toBe(false);
  });
});
