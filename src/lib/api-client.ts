'use client';

import type { FormikErrors } from 'formik';
import { useCallback, useState } from 'react';

// The browser's one way to talk to our route handlers (every change goes through one; there are no server
// actions). Reads throw ApiError so SWR can show them; writes never throw and answer { ok, status, body }
// so a form can put a 422's messages on its fields and show a 409's newer record beside its own values.
// No zod here: the customer pages import this file and must stay light.

export type FieldError = { field: string; message: string };
/** What our handlers answer on a refusal: a message, 422 field errors, and on a 409 the record as now saved. */
export type ApiBody = { message?: string; errors?: FieldError[]; current?: unknown };
export type ApiAnswer<T = unknown> = { ok: boolean; status: number; body: T & ApiBody };
export type Method = 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export const NO_ANSWER = 'The server could not be reached. Nothing was saved; check the connection and try again.';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiBody,
  ) {
    // The field errors first (a 422 says what to fix), then the server's message, then the bare status.
    super(
      (body.errors ?? []).map((e) => `${e.field}: ${e.message}`).join('; ') ||
        body.message ||
        (status === 401 ? 'You are signed out. Sign in again.' : `The server answered ${status}.`),
    );
  }
}

async function readBody(response: Response): Promise<Record<string, unknown>> {
  return (await response.json().catch(() => ({}))) as Record<string, unknown>;
}

/** GET a JSON answer; the SWR fetcher for every list and record. Throws ApiError on a refusal. */
export async function getJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: 'application/json' }, credentials: 'same-origin' });
  const body = await readBody(response);
  if (!response.ok) throw new ApiError(response.status, body);
  return body as T;
}

/** POST a question and read the answer, for SWR keys that compute rather than change (the advisor's ranking). */
export async function postForJson<T>(url: string, payload: unknown): Promise<T> {
  const answer = await sendJson<T>('POST', url, payload);
  if (!answer.ok) throw new ApiError(answer.status, answer.body);
  return answer.body;
}

/** Sends a change as JSON (or a FormData upload as it is) and reads the answer; never throws. */
export async function sendJson<T = Record<string, unknown>>(
  method: Method,
  url: string,
  payload?: unknown,
): Promise<ApiAnswer<T>> {
  const isForm = typeof FormData !== 'undefined' && payload instanceof FormData;
  try {
    const response = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers:
        isForm || payload === undefined
          ? { accept: 'application/json' }
          : { 'content-type': 'application/json', accept: 'application/json' },
      body: payload === undefined ? undefined : isForm ? payload : JSON.stringify(payload),
    });
    return { ok: response.ok, status: response.status, body: (await readBody(response)) as T & ApiBody };
  } catch {
    return { ok: false, status: 0, body: { message: NO_ANSWER } as T & ApiBody };
  }
}

/**
 * A 422's field errors (the server's zod issues, `{ field: 'profile.engine.boreIn', message }`) in formik's
 * shape: nested by the dots in the field name, the first message for a field kept.
 */
export function formErrors<T>(answer: { body: ApiBody }): FormikErrors<T> {
  const out: Record<string, unknown> = {};
  for (const { field, message } of answer.body.errors ?? []) {
    const path = field.split('.');
    let node = out;
    path.slice(0, -1).forEach((key) => {
      if (typeof node[key] !== 'object' || node[key] === null) node[key] = {};
      node = node[key] as Record<string, unknown>;
    });
    const last = path[path.length - 1];
    if (node[last] === undefined) node[last] = message;
  }
  return out as FormikErrors<T>;
}

/** The 422's messages in one line ("label: too long; hours: …"), for a form that shows them above its fields. */
export function errorsText(answer: { body: ApiBody }): string {
  return (answer.body.errors ?? []).map((e) => `${e.field}: ${e.message}`).join('; ');
}

/**
 * Saves a record that carries a `version` (optimistic locking). Each save sends the version this page last
 * read; a newer save by someone else answers 409 with `current`, which lands in `conflict` and overwrites
 * nothing. `settle('theirs' | 'mine')` then takes their version as the base: 'theirs' to load their values,
 * 'mine' to keep the typed ones and save again on top of theirs.
 */
export function useVersionedSave<T extends { version?: number }>(record: T | null) {
  const [base, setBase] = useState<T | null>(record);
  const [conflict, setConflict] = useState<T | null>(null);
  // A page that reads the record again (router.refresh, an SWR reload) hands in a newer version: that becomes
  // the base, so the next save does not answer 409 over a change this page already shows. Compared by version,
  // not identity, so a record built afresh on every render is no change.
  const [seenVersion, setSeenVersion] = useState(record?.version);
  if (record?.version !== seenVersion) {
    setSeenVersion(record?.version);
    if (record && (record.version ?? 0) > (base?.version ?? 0)) setBase(record);
  }

  const save = useCallback(
    async (method: Method, url: string, payload: Record<string, unknown>): Promise<ApiAnswer<T>> => {
      const answer = await sendJson<T>(
        method,
        url,
        // A version in the payload wins: a one-click "keep mine" sends again on the version settle() just handed back.
        base && method !== 'POST' ? { version: base.version, ...payload } : payload,
      );
      if (answer.ok) {
        setBase(answer.body);
        setConflict(null);
      } else if (answer.status === 409 && answer.body.current) setConflict(answer.body.current as T);
      return answer;
    },
    [base],
  );

  const settle = useCallback(() => {
    if (!conflict) return null;
    setBase(conflict);
    setConflict(null);
    return conflict;
  }, [conflict]);

  return { base, version: base?.version, conflict, save, settle };
}
