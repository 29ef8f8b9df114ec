import { clientAddressFrom, trustedProxyHops } from '@/lib/http/client-address';

// Which address counts for throttling and audit: the socket's, unless a setting names proxies in front.
describe('clientAddressFrom', () => {
  it('with no trusted proxy takes the socket address and ignores X-Forwarded-For entirely', () => {
    expect(clientAddressFrom('203.0.113.9', '198.51.100.4', 0)).toBe('198.51.100.4');
    expect(clientAddressFrom(undefined, '::ffff:127.0.0.1', 0)).toBe('127.0.0.1');
  });

  it('with one trusted proxy takes the entry that proxy wrote, not what the caller prepended', () => {
    // caller sent "X-Forwarded-For: 10.9.9.9"; the proxy appended the caller's real address
    expect(clientAddressFrom('10.9.9.9, 203.0.113.9', '192.0.2.1', 1)).toBe('203.0.113.9');
    expect(clientAddressFrom(['10.9.9.9', '203.0.113.9'], '192.0.2.1', 1)).toBe('203.0.113.9');
  });

  it('with two trusted proxies walks two entries from the right, and never past the left end', () => {
    expect(clientAddressFrom('203.0.113.9, 192.0.2.7', '192.0.2.1', 2)).toBe('203.0.113.9');
    expect(clientAddressFrom(undefined, '192.0.2.1', 3)).toBe('192.0.2.1');
  });

  it('reads TRUSTED_PROXY_HOPS as a small whole number, anything else as 0', () => {
    expect(trustedProxyHops(undefined)).toBe(0);
    expect(trustedProxyHops('2')).toBe(2);
    expect(trustedProxyHops('-1')).toBe(0);
    expect(trustedProxyHops('one')).toBe(0);
    expect(trustedProxyHops('1.5')).toBe(0);
  });
});
