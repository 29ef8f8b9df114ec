// Browser-side calls to the catalogue API: one fetcher for SWR, one for writes.
export class ApiError extends Error {
  constructor(readonly status: number, readonly body: { message?: string; errors?: { field: string; message: string }[]; current?: unknown }) {
    super(body.message ?? `The server answered ${status}.`);
  }
}

export async function getJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await response.json().catch(() => ({}));
  if (!response.ok) throw new ApiError(response.status, body);
  return body as T;
}

export async function sendJson<T>(method: 'POST' | 'PATCH' | 'DELETE', url: string, payload?: unknown): Promise<{ status: number; body: T & { message?: string; errors?: { field: string; message: string }[]; current?: unknown } }> {
  try {
    const response = await fetch(url, {
      method,
      headers: { 'content-type': 'application/json', accept: 'application/json' },
      body: payload === undefined ? undefined : JSON.stringify(payload),
    });
    const body = await response.json().catch(() => ({}));
    return { status: response.status, body };
  } catch {
    return { status: 0, body: { message: 'The server could not be reached. Check the connection and try again.' } as never };
  }
}
