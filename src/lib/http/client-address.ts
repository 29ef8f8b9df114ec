// Which address a request came from, decided once per request from the socket, never from what
// the caller wrote. Pure, so it can be tested without a server.

/** The header the server hook (src/lib/http/peer-hook.ts) writes; any value a caller sends is overwritten. */
export const CLIENT_ADDRESS_HEADER = 'x-lobewise-client-address';

/** TRUSTED_PROXY_HOPS: how many proxies in front of the app add themselves to X-Forwarded-For. */
export function trustedProxyHops(raw = process.env.TRUSTED_PROXY_HOPS): number {
  const hops = Number(raw ?? '0');
  return Number.isInteger(hops) && hops >= 0 && hops <= 10 ? hops : 0;
}

function tidy(address: string): string {
  return (
    address
      .trim()
      .replace(/^::ffff:/, '')
      .slice(0, 64) || 'unknown'
  );
}

/**
 * With no trusted proxy, the socket's peer. With N trusted proxies, the chain is X-Forwarded-For plus
 * the socket's peer (the nearest proxy); the client is the entry N places from the right — the last
 * one a trusted proxy wrote. Entries further left were written by whoever called the first proxy.
 */
export function clientAddressFrom(
  forwardedFor: string | string[] | undefined,
  socketAddress: string | undefined,
  hops: number,
): string {
  const peer = socketAddress ?? 'unknown';
  if (hops === 0) return tidy(peer);
  const listed = ([] as string[])
    .concat(forwardedFor ?? [])
    .join(',')
    .split(',')
    .map((part) => part.trim())
    .filter(Boolean);
  const chain = [...listed, peer];
  return tidy(chain[Math.max(0, chain.length - 1 - hops)]);
}
