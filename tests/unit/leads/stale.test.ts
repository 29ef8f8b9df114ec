import { lastTouch, staleCutoff, staleDays } from '@/lib/leads/stale';

// When a lead counts as gone cold. Fixed dates: the rule takes "now" as an argument.
const NOW = new Date('2026-12-10T12:00:00Z');
const lead = (createdAt: string, status = 'new') => ({ status, createdAt });

describe('stale leads', () => {
  it('flags a new lead untouched for the limit or longer, with the whole days it has waited', () => {
    expect(staleDays(lead('2026-12-08T12:00:00Z'), [], NOW, 2)).toBe(2); // exactly two days
    expect(staleDays(lead('2026-12-05T09:00:00Z'), [], NOW, 2)).toBe(5); // 5 days 3 hours → 5
    expect(staleDays(lead('2026-12-08T12:00:01Z'), [], NOW, 2)).toBeNull(); // one second short
  });
  it('counts a note as contact: the newest note restarts the wait', () => {
    const old = lead('2026-12-01T12:00:00Z');
    expect(lastTouch(old, ['2026-12-03T08:00:00Z', '2026-12-09T18:00:00Z']).toISOString()).toBe(
      '2026-12-09T18:00:00.000Z',
    );
    expect(staleDays(old, ['2026-12-09T18:00:00Z'], NOW, 2)).toBeNull();
    expect(staleDays(old, ['2026-12-03T08:00:00Z'], NOW, 2)).toBe(7);
  });
  it('never flags a lead that has moved past new', () => {
    for (const status of ['contacted', 'quoted', 'closed'])
      expect(staleDays(lead('2026-11-01T00:00:00Z', status), [], NOW, 2)).toBeNull();
  });
  it('follows the shop’s limit', () => {
    const l = lead('2026-12-09T06:00:00Z'); // 1 day 6 hours ago
    expect(staleDays(l, [], NOW, 1)).toBe(1);
    expect(staleDays(l, [], NOW, 2)).toBeNull();
    expect(staleCutoff(NOW, 3).toISOString()).toBe('2026-12-07T12:00:00.000Z');
  });
});
