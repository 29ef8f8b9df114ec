'use client';

import { useRef, useState } from 'react';
import useSWR from 'swr';
import { getJson, sendJson } from '@/lib/api-client';
import { bytes } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { buttonClass } from '@/components/ui/button';

type Attachment = {
  id: number;
  fileName: string;
  contentType: string;
  byteSize: number;
  createdAt: string;
  url: string;
};

// Spec sheets on a cam, part or labour operation: any staff member opens them, managers add and remove.
export function Attachments({ baseUrl, canEdit }: { baseUrl: string; canEdit: boolean }) {
  const { data, error, isLoading, mutate } = useSWR<{ items: Attachment[] }>(`${baseUrl}/attachments`, getJson);
  const [message, setMessage] = useState<{ tone: 'ok' | 'fault'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const input = useRef<HTMLInputElement>(null);

  async function upload(file: File) {
    setBusy(true);
    setMessage(null);
    const form = new FormData();
    form.set('file', file);
    const { ok, status, body } = await sendJson<{ fileName?: string }>('POST', `${baseUrl}/attachments`, form);
    if (ok) {
      setMessage({ tone: 'ok', text: `${body.fileName} added.` });
      await mutate();
    } else if (status === 0)
      setMessage({ tone: 'fault', text: 'The server could not be reached; nothing was uploaded.' });
    else setMessage({ tone: 'fault', text: body.message ?? `The server answered ${status}.` });
    setBusy(false);
    if (input.current) input.current.value = '';
  }

  return (
    <section aria-labelledby="attachments-title" className="flex flex-col gap-2">
      <h2 id="attachments-title" className="text-lg font-semibold">
        Spec sheets
      </h2>
      {message ? (
        <Banner tone={message.tone} title={message.tone === 'ok' ? 'Uploaded' : 'Not uploaded'}>
          {message.text}
        </Banner>
      ) : null}
      {error ? (
        <Banner tone="fault" title="The spec sheets could not be listed">
          {error.message}
        </Banner>
      ) : null}
      {isLoading ? <p className="text-sm text-ink-soft">Loading spec sheets…</p> : null}
      {data && data.items.length === 0 ? <p className="text-sm text-ink-soft">No spec sheet attached yet.</p> : null}
      <ul className="flex flex-col gap-1">
        {data?.items.map((a) => (
          <li key={a.id} className="flex flex-wrap items-center gap-3 text-sm">
            <a
              href={a.url}
              target="_blank"
              rel="noopener"
              className="font-semibold text-gauge-700 underline-offset-2 hover:underline"
            >
              {a.fileName}
            </a>
            <span className="spec text-xs text-ink-muted">
              {a.contentType === 'application/pdf' ? 'PDF' : a.contentType === 'image/png' ? 'PNG' : 'JPEG'} ·{' '}
              {bytes(a.byteSize)}
            </span>
            {canEdit ? (
              <button
                type="button"
                className="text-xs text-fault-700 underline"
                onClick={async () => {
                  if (!window.confirm(`Remove ${a.fileName}?`)) return;
                  const result = await sendJson('DELETE', a.url);
                  setMessage(
                    result.status === 200
                      ? { tone: 'ok', text: `${a.fileName} removed.` }
                      : { tone: 'fault', text: result.body.message ?? 'Not removed.' },
                  );
                  await mutate();
                }}
              >
                Remove
              </button>
            ) : null}
          </li>
        ))}
      </ul>
      {canEdit ? (
        <div className="flex flex-wrap items-center gap-2">
          <label className={buttonClass('quiet', 'cursor-pointer')}>
            {busy ? 'Uploading…' : 'Attach a PDF, PNG or JPEG (up to 5 MB)'}
            <input
              ref={input}
              type="file"
              accept="application/pdf,image/png,image/jpeg"
              className="sr-only"
              disabled={busy}
              onChange={(e) => e.target.files?.[0] && upload(e.target.files[0])}
            />
          </label>
        </div>
      ) : null}
    </section>
  );
}
