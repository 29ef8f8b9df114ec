import net from 'node:net';

// Starting a server on a free loopback port and waiting until it answers: shared by the benches
// (bench-load, bench-lighthouse, bench-scale) and the integration tests' set-up.

/** A port nothing listens on right now (the OS picks it; the caller binds it soon after). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** Resolves once `url` answers 2xx; throws after `timeoutMs` with the last answer or error seen. */
export async function waitForOk(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError = '';
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url);
      if (response.ok) return;
      lastError = `HTTP ${response.status}`;
    } catch (error) {
      lastError = String(error);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not come up in ${timeoutMs} ms (${lastError})`);
}
