// The job page's calls to /api/jobs: one place that turns an answer into fields, a message, or the job.
import type { BoardJob } from '@/lib/jobs/types';
import { sendJson, type ApiAnswer } from '@/lib/api-client';

export type ApiResult = { ok: true; job: BoardJob } | { ok: false; message: string; fields: Record<string, string> };

export async function sendJob(url: string, method: 'PATCH' | 'POST', body: unknown): Promise<ApiResult> {
  return jobResult(await sendJson<BoardJob>(method, url, body));
}

/** An answer about a job as the job page shows it: the job, or a message and the fields it names. */
export function jobResult(answer: ApiAnswer<BoardJob>): ApiResult {
  if (answer.ok) return { ok: true, job: answer.body };
  const fields = Object.fromEntries((answer.body.errors ?? []).map((e) => [e.field, e.message]));
  if (answer.status === 401)
    return { ok: false, message: 'You are signed out. Sign in again; nothing was saved.', fields };
  return { ok: false, message: answer.body.message ?? `Not saved (${answer.status}).`, fields };
}
