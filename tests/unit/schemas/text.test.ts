import { z } from 'zod';
import { inviteUserSchema, updateUserSchema } from '@/lib/schemas/user';
import { CustomerSchema } from '@/lib/schemas/customer';
import { formatZodIssues } from '@/lib/schemas/errors';
import { LeadAnswersSchema } from '@/lib/schemas/lead';
import { PartSchema } from '@/lib/schemas/part';
import { ShopSettingsSchema } from '@/lib/schemas/settings';
import { text, unsafeTextReason } from '@/lib/schemas/text';

// The shared text base (issue 13, item 5): what it refuses, what it keeps, and that the entity
// schemas use it (each names the field in its error).
const BAD = ['\ud800', 'a\udc00b', 'x\u0000y', '\u001b[2J', 'a\u007fb', 'a\u0085b', 'a\u000bb', 'a\u000cb'];

function issuesOf(schema: z.ZodType, value: unknown) {
  const parsed = schema.safeParse(value);
  return parsed.success ? [] : formatZodIssues(parsed.error);
}

describe('text()', () => {
  it.each(BAD)('refuses %j in single- and multi-line text, naming the label', (bad) => {
    for (const multiline of [false, true]) {
      const result = text('notes', { multiline }).safeParse(`before ${bad} after`);
      expect(result.success).toBe(false);
      expect(result.error?.issues[0].message).toMatch(/^notes /);
    }
  });

  it('refuses line breaks in single-line text (they could split an e-mail header) and keeps tabs', () => {
    expect(text('name').safeParse('Ines\r\nBcc: x@example.com').success).toBe(false);
    expect(text('name').safeParse('Ines\nMarrow').success).toBe(false);
    expect(text('name').safeParse('Ines\u2028Marrow').success).toBe(false);
    expect(text('name').parse('Ines\tMarrow')).toBe('Ines\tMarrow');
  });

  it('trims first, so a trailing newline from a paste is not an error', () => {
    expect(text('name').parse('  Ines Marrow\r\n')).toBe('Ines Marrow');
  });

  it('turns CRLF and lone CR into LF in multi-line text', () => {
    expect(text('notes', { multiline: true }).parse('one\r\ntwo\rthree\nfour')).toBe('one\ntwo\nthree\nfour');
  });

  it('keeps real non-ASCII text, including characters outside the BMP (paired surrogates)', () => {
    expect(text('name').parse('Zoë Ångström 🚗 дизель')).toBe('Zoë Ångström 🚗 дизель');
    expect(unsafeTextReason('😀')).toBeNull();
  });

  it('chains with the usual checks', () => {
    const name = text('name').min(1, 'name must not be empty').max(5, 'name must be at most 5 characters');
    expect(name.safeParse('   ').error?.issues[0].message).toBe('name must not be empty');
    expect(name.safeParse('abcdef').error?.issues[0].message).toBe('name must be at most 5 characters');
  });
});

describe('the entity schemas use it', () => {
  const lead = {
    engine: '5.3',
    use: 'daily',
    idle: 'smooth',
    emissions: 'no',
    transmission: 'manual',
    driveline: 'stock',
    exhaust: 'stock',
    budget: 'unsure',
    name: 'Ines Marrow',
    email: 'ines@example.com',
    consent: true,
  };

  it.each([
    ['lead name', LeadAnswersSchema, { ...lead, name: 'Ines \ud800' }, 'name'],
    ['lead phone', LeadAnswersSchema, { ...lead, phone: '555\u00000107' }, 'phone'],
    ['customer name', CustomerSchema, { name: 'Ines\nMarrow' }, 'name'],
    ['customer notes', CustomerSchema, { name: 'Ines Marrow', notes: 'x\u0000' }, 'notes'],
    ['invited staff name', inviteUserSchema, { email: 'new@lobewise.test', name: '\ud800', role: 'tech' }, 'name'],
    ['renamed staff', updateUserSchema, { version: 1, name: 'A\u001bB' }, 'name'],
    [
      'part spec value',
      PartSchema,
      { sku: 'SP-1', name: 'Spring set', category: 'springs', priceCents: 100, spec: { seat: 'x\ud800' } },
      'spec.seat',
    ],
  ] as const)('%s', (_label, schema, value, field) => {
    expect(issuesOf(schema as z.ZodType, value).map((i) => i.field)).toContain(field);
  });

  it('the shop settings keep line breaks in the deposit policy but not in the shop name', () => {
    const settings = {
      name: 'Tallgrass Dyno',
      address: '1 Mill Road\nNorth Bend',
      phone: '555-0100',
      email: '',
      laborRateCents: 12000,
      taxRateBp: 800,
      depositPercentBp: 2000,
      depositMinCents: 5000,
      depositMaxCents: 50000,
      depositPolicyText: 'Refundable within 7 days.\r\nAsk us.',
    };
    expect(ShopSettingsSchema.parse(settings).depositPolicyText).toBe('Refundable within 7 days.\nAsk us.');
    expect(issuesOf(ShopSettingsSchema, { ...settings, name: 'Tallgrass\r\nDyno' }).map((i) => i.field)).toEqual([
      'name',
    ]);
  });
});
