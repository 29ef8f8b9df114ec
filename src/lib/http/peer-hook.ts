import http from 'node:http';
import { CLIENT_ADDRESS_HEADER, clientAddressFrom, trustedProxyHops } from './client-address';

// Route handlers never see the socket, and Next's server copies the socket address into
// X-Forwarded-For only when the caller sent none (`??=`), so that header is the caller's to choose.
// This hook runs first for every request the Node server receives and stamps the address decided
// from the socket (and TRUSTED_PROXY_HOPS) into one header, replacing anything the caller put there.
const MARK = Symbol.for('lobewise.peerHook');

export function installPeerHook(): void {
  const proto = http.Server.prototype as unknown as Record<symbol, boolean> & {
    emit: (event: string, ...args: unknown[]) => boolean;
  };
  if (proto[MARK]) return;
  proto[MARK] = true;
  const hops = trustedProxyHops();
  const originalEmit = proto.emit;
  proto.emit = function emit(this: http.Server, event: string, ...args: unknown[]) {
    if (event === 'request') {
      const request = args[0] as http.IncomingMessage;
      request.headers[CLIENT_ADDRESS_HEADER] = clientAddressFrom(
        request.headers['x-forwarded-for'],
        request.socket?.remoteAddress,
        hops,
      );
    }
    return originalEmit.call(this, event, ...args);
  };
}
