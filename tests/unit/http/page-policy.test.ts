import { pageContentSecurityPolicy, paymentsCheckoutOrigin } from '@/lib/http/page-policy';
import { headerValue } from '@/lib/mail';

// Issue 13, item 8: form-action names this site and exactly one payments origin, never a wildcard.
const formAction = (policy: string) => policy.split('; ').find((d) => d.startsWith('form-action '));

describe('paymentsCheckoutOrigin', () => {
  it('uses PAYMENTS_CHECKOUT_ORIGIN when set (its origin only)', () => {
    expect(paymentsCheckoutOrigin({ PAYMENTS_CHECKOUT_ORIGIN: 'https://pay.example.com/some/path?x=1' })).toBe(
      'https://pay.example.com',
    );
  });

  it('points at the local payments fake when the SDK is pointed there', () => {
    expect(
      paymentsCheckoutOrigin({ STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PORT: '12111', STRIPE_API_PROTOCOL: 'http' }),
    ).toBe('http://127.0.0.1:12111');
  });

  it('falls back to the real provider over https, ignoring a malformed override', () => {
    const origin = paymentsCheckoutOrigin({ PAYMENTS_CHECKOUT_ORIGIN: 'javascript:alert(1)' });
    expect(origin.startsWith('https://')).toBe(true);
    expect(new URL(origin).origin).toBe(origin);
  });
});

describe('pageContentSecurityPolicy', () => {
  it("allows forms to 'self' and the payments origin only", () => {
    const policy = pageContentSecurityPolicy({
      STRIPE_API_HOST: '127.0.0.1',
      STRIPE_API_PORT: '4242',
      STRIPE_API_PROTOCOL: 'http',
    });
    expect(formAction(policy)).toBe("form-action 'self' http://127.0.0.1:4242");
    expect(policy).not.toMatch(/https:(?:\s|;|$)|\*/);
    expect(policy).toContain("frame-ancestors 'none'");
  });
});

describe('headerValue (the last guard before a mail header)', () => {
  it('puts CR/LF on one line and drops other control characters', () => {
    expect(headerValue('New lead: Ines\r\nBcc: everyone@example.com')).toBe('New lead: Ines Bcc: everyone@example.com');
    expect(headerValue('a\u0000b\u001bc')).toBe('abc');
  });
});
