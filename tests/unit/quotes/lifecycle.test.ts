import {
  canRevise,
  canTransition,
  QUOTE_STATE_LIST,
  refusalMessage,
  revisionNumber,
  staffMoves,
  STATE_WORDS,
  validUntilFrom,
} from '@/lib/quotes/lifecycle';

// The lifecycle's rules, pure: who may make which move, and the words for each state.
describe('quote lifecycle', () => {
  it('gives every state a word', () => {
    for (const s of QUOTE_STATE_LIST) expect(STATE_WORDS[s]).toMatch(/\w/);
  });

  it('lets staff make only the hand moves; sending, paying, refunding and revising belong to their flows', () => {
    expect(staffMoves('draft')).toEqual(['cancelled']);
    expect(staffMoves('sent').sort()).toEqual(['accepted', 'cancelled', 'declined', 'expired']);
    expect(staffMoves('accepted').sort()).toEqual(['cancelled', 'declined', 'expired']);
    expect(staffMoves('deposit-paid')).toEqual(['closed']);
    for (const end of ['closed', 'declined', 'expired', 'cancelled', 'replaced'] as const)
      expect(staffMoves(end)).toEqual([]);
    expect(canTransition('sent', 'deposit-paid', 'staff')).toBe(false);
    expect(canTransition('sent', 'deposit-paid', 'payment')).toBe(true);
    expect(canTransition('deposit-paid', 'cancelled', 'staff')).toBe(false);
    expect(canTransition('deposit-paid', 'cancelled', 'refund')).toBe(true);
    expect(canTransition('draft', 'sent', 'send')).toBe(true);
    expect(canTransition('cancelled', 'deposit-paid', 'payment')).toBe(false);
    // The balance paid in full closes the job; only a refund (money owed again) reopens a closed one.
    expect(canTransition('deposit-paid', 'closed', 'payment')).toBe(true);
    expect(canTransition('sent', 'closed', 'payment')).toBe(false);
    expect(canTransition('closed', 'deposit-paid', 'payment')).toBe(false);
    expect(canTransition('closed', 'deposit-paid', 'staff')).toBe(false);
    expect(canTransition('closed', 'deposit-paid', 'refund')).toBe(true);
    expect(canTransition('closed', 'cancelled', 'refund')).toBe(false);
  });

  it('says how a move is made when it belongs to another flow', () => {
    expect(refusalMessage('sent', 'deposit-paid', 'staff')).toMatch(/customer paying/);
    expect(refusalMessage('cancelled', 'sent', 'staff')).toMatch(/Nothing more can happen/);
  });

  it('revises unpaid quotes only and numbers revisions -R2, -R3', () => {
    expect(canRevise('sent')).toBe(true);
    expect(canRevise('draft')).toBe(false);
    expect(canRevise('deposit-paid')).toBe(false);
    expect(revisionNumber('Q-2026-0101', 2)).toBe('Q-2026-0101-R2');
    expect(revisionNumber('Q-2026-0101-R2', 3)).toBe('Q-2026-0101-R3');
  });

  it('dates a quote 30 days on by default (UTC days)', () => {
    expect(validUntilFrom(new Date('2026-01-31T23:30:00Z'))).toBe('2026-03-02');
  });
});
