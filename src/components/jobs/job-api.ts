// The job page's calls to /api/jobs: one place that turns an answer into fields, a message, or the job.
import type { BoardJob } from '@/lib/db/queries/job-board';

export type ApiResult = { ok: true; job: BoardJob } | { ok: false; message: string; fields: Record<string, string> };

export async function sendJob(url: string, method: 'PATCH' | 'POST', body: unknown): Promise<ApiResult> {
  let response: Response;
  try {
    response = await fetch(url, { method, credentials: 'same-origin', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  } catch {
    return { ok: false, message: 'The server could not be reached. Nothing was saved; try again.', fields: {} };
  }
  const data = (await response.json().catch(() => ({}))) as { message?: string; errors?: { field: string; message: string }[] } & Partial<BoardJob>;
  if (response.ok) return { ok: true, job: data as BoardJob };
  const fields = Object.fromEntries((data.errors ?? []).map((e) => [e.field, e.message]));
  if (response.status === 401) return { ok: false, message: 'You are signed out. Sign in again; nothing was saved.', fields };
  return { ok: false, message: data.message ?? `Not saved (${response.status}).`, fields };
}
