import { approvalAfterSave, pendingApprovalMessage } from '@/lib/quotes/discount-approval';

// Where a quote's discount stands after its lines are saved (src/lib/quotes/discount-approval.ts).
const save = (over: Partial<Parameters<typeof approvalAfterSave>[0]>) =>
  approvalAfterSave({ byManager: false, overLimit: true, discountBp: 1_200, before: null, ...over });

describe('approvalAfterSave', () => {
  it('needs nothing within the limit, whoever saves and whatever stood before', () => {
    expect(save({ overLimit: false })).toBe('none');
    expect(save({ overLimit: false, byManager: true })).toBe('none');
    expect(save({ overLimit: false, before: { state: 'pending', discountBp: 1_200 } })).toBe('none');
  });

  it('waits for a manager when counter staff save more than the limit', () => {
    expect(save({})).toBe('pending');
    expect(save({ before: { state: 'none', discountBp: 0 } })).toBe('pending');
    expect(save({ before: { state: 'pending', discountBp: 2_000 } })).toBe('pending');
  });

  it('is approved when a manager saves it', () => {
    expect(save({ byManager: true })).toBe('approved');
    expect(save({ byManager: true, before: { state: 'pending', discountBp: 500 } })).toBe('approved');
  });

  it('keeps an approval while counter staff do not raise the share, and waits again when they do', () => {
    const approved = { state: 'approved' as const, discountBp: 1_200 };
    expect(save({ discountBp: 1_200, before: approved })).toBe('approved');
    expect(save({ discountBp: 900, before: approved })).toBe('approved');
    expect(save({ discountBp: 1_201, before: approved })).toBe('pending');
  });
});

describe('pendingApprovalMessage', () => {
  it('names the quote, the share and the pending approval', () => {
    const message = pendingApprovalMessage('Q-2026-0042', '12 %');
    expect(message).toContain('Q-2026-0042');
    expect(message).toContain('12 %');
    expect(message).toMatch(/pending discount approval/);
  });
});
