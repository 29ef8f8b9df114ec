import { contactKeys, normaliseEmail, normalisePhone } from '@/lib/leads/contact-key';

describe('lead contact keys (the flood guard counts people, not spellings)', () => {
  it('folds case and drops a +tag from an e-mail address', () => {
    expect(normaliseEmail(' Wren.H+cams@Example.COM ')).toBe('wren.h@example.com');
    expect(normaliseEmail('wren.h@example.com')).toBe('wren.h@example.com');
    expect(normaliseEmail('+only@example.com')).toBe('+only@example.com');
  });

  it('keeps only the digits of a phone, without a leading 1 on an 11-digit number', () => {
    expect(normalisePhone('(555) 010-7788')).toBe('5550107788');
    expect(normalisePhone('+1 555 010 7788')).toBe('5550107788');
    expect(normalisePhone('555.0107')).toBe('5550107');
  });

  it('gives one key per contact given', () => {
    expect(contactKeys({ email: 'A+b@x.example', phone: '555-0107' })).toEqual(['email:a@x.example', 'phone:5550107']);
    expect(contactKeys({})).toEqual([]);
  });
});
