// Reads the environment once, with clear messages for what is missing. Server-only.
export function requireEnv(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set; see .env.example for what it should hold.`);
  return value;
}

export function appBaseUrl(): string {
  return (process.env.APP_BASE_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
}
