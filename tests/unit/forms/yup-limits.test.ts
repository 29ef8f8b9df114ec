import * as yup from 'yup';
import { centsFromText } from '@/lib/format';
import { moneyWithin, nestFieldErrors, numberWithin, textUpTo, validateWithYup } from '@/lib/forms/yup-limits';
import { LABOR_LIMITS, LaborSchema } from '@/lib/schemas/labor';
import { SETTINGS_LIMITS } from '@/lib/schemas/settings';

// The browser's checks come from the same limits the zod schemas export; the server still checks with zod.
const validate = validateWithYup<Record<string, string>>(
  yup.object({
    hours: numberWithin('hours', 'h', LABOR_LIMITS.hours, { required: true }),
    stock: numberWithin('stock on hand', 'units', { min: 0, max: 10 }, { integer: true }),
    rate: moneyWithin('labour rate', SETTINGS_LIMITS.laborRateCents, centsFromText, { required: true }),
    name: textUpTo('name', LABOR_LIMITS.nameMaxLength, { required: true }),
  }),
);

describe('yup checks built from the schemas’ limits', () => {
  it('passes values inside every limit', () => {
    expect(validate({ hours: '1.5', stock: '', rate: '120.00', name: 'Cam swap' })).toEqual({});
  });

  it('names the field, the limit and the unit for each value outside it', () => {
    const errors = validate({
      hours: String(LABOR_LIMITS.hours.max + 1),
      stock: '2.5',
      rate: '1000.01',
      name: 'x'.repeat(LABOR_LIMITS.nameMaxLength + 1),
    });
    expect(errors.hours).toBe(`hours must be at most ${LABOR_LIMITS.hours.max} h`);
    expect(errors.stock).toBe('stock on hand must be a whole number');
    expect(errors.rate).toBe('labour rate must be between $0.00 and $1000.00');
    expect(errors.name).toBe(`name must be at most ${LABOR_LIMITS.nameMaxLength} characters`);
  });

  it('says what is missing or not a number', () => {
    const errors = validate({ hours: 'lots', stock: '', rate: '', name: ' ' });
    expect(errors).toEqual({
      hours: 'hours must be a number (h)',
      rate: 'labour rate is required',
      name: 'name must not be empty',
    });
  });

  it('agrees with the zod schema at the edge of the range (the server re-validates)', () => {
    const edge = LABOR_LIMITS.hours.max;
    expect(validate({ hours: String(edge), rate: '1', name: 'n' }).hours).toBeUndefined();
    const zod = LaborSchema.safeParse({ code: 'L-1', name: 'n', hours: edge + 0.01, engines: 'all', active: true });
    expect(zod.error?.issues.map((i) => i.path.join('.'))).toContain('hours');
    expect(validate({ hours: String(edge + 0.01), rate: '1', name: 'n' }).hours).toBeDefined();
  });
});

describe('flat field errors in formik’s nested shape', () => {
  it('nests list items by index and lets a list’s own message stand for the list', () => {
    expect(
      nestFieldErrors({ label: 'label must not be empty', 'items.1.quantity': 'quantity must be at most 99' }),
    ).toEqual({
      label: 'label must not be empty',
      items: [undefined, { quantity: 'quantity must be at most 99' }],
    });
    expect(
      nestFieldErrors({
        'items.0.partId': 'each item needs a part, a labour operation or both',
        items: 'a rule may add at most 12 items',
      }),
    ).toEqual({
      items: 'a rule may add at most 12 items',
    });
  });
});
