// Runs once when the server starts: refuse to start without a usable session secret, with a
// message that says what to fix, instead of failing later on the first sign-in; then make every
// request carry the address its socket came from (src/lib/http/peer-hook.ts).
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { sessionSecret } = await import('./lib/auth/config');
  try {
    sessionSecret();
  } catch (error) {
    throw new Error(`[lobewise] cannot start: ${(error as Error).message}`);
  }
  const { installPeerHook } = await import('./lib/http/peer-hook');
  installPeerHook();
}
