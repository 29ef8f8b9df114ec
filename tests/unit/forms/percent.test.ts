import { bpFromPercentText, bpToPercentText } from '@/lib/format';
import { percentWithin } from '@/lib/forms/yup-limits';

// Rates are stored as basis points (integer, exact) and typed as percents: 8.25 % is 825 bp.
describe('a rate typed as a percent', () => {
  it('reads percents with up to two decimals into basis points', () => {
    expect(bpFromPercentText('8.25')).toBe(825);
    expect(bpFromPercentText(' 8.25 % ')).toBe(825);
    expect(bpFromPercentText('20%')).toBe(2000);
    expect(bpFromPercentText('7.5')).toBe(750);
    expect(bpFromPercentText('0')).toBe(0);
  });

  it('refuses what is not a percent with at most two decimals', () => {
    for (const bad of ['', 'abc', '8.255', '-1', '8,25', '1e2', '.5']) expect(bpFromPercentText(bad)).toBeNull();
  });

  it('writes basis points back into the box as they are read', () => {
    for (const bp of [0, 5, 750, 825, 2000, 10_000]) expect(bpFromPercentText(bpToPercentText(bp))).toBe(bp);
  });

  it('says the range in percent, from the same limits the server checks in basis points', async () => {
    const schema = percentWithin('tax rate', { min: 0, max: 3000 }, bpFromPercentText, { required: true });
    await expect(schema.validate('8.25')).resolves.toBe('8.25');
    await expect(schema.validate('31')).rejects.toThrow('tax rate must be between 0 % and 30 %');
    await expect(schema.validate('8.255')).rejects.toThrow(
      'tax rate must be a percent with at most two decimals, e.g. 8.25',
    );
    await expect(schema.validate('')).rejects.toThrow('tax rate is required');
  });
});
