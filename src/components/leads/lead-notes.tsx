'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import type { LeadNoteView } from '@/lib/leads/types';
import { LEAD_NOTE_LIMITS } from '@/lib/schemas/lead-note';
import { sendJson } from '@/lib/api-client';

// The lead's note log: who spoke to the customer, when, what was said; and a box to add the next entry.
export function LeadNotes({ leadId, notes }: { leadId: number; notes: LeadNoteView[] }) {
  const router = useRouter();
  const [body, setBody] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  async function add() {
    setSaving(true);
    setMessage(null);
    const answer = await sendJson('POST', `/api/leads/${leadId}/notes`, { body });
    setSaving(false);
    if (answer.ok) {
      setBody('');
      setMessage('Note added.');
      router.refresh();
    } else if (answer.status === 0) setMessage('Not saved: the server could not be reached.');
    else setMessage(answer.body.errors?.[0]?.message ?? answer.body.message ?? `Not saved (${answer.status}).`);
  }

  return (
    <section aria-label={`Notes on lead ${leadId}`} className="mt-3">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-muted">Notes</h3>
      {notes.length === 0 ? <p className="text-ink-muted">No notes yet.</p> : null}
      <ol className="mt-1 flex flex-col gap-1">
        {notes.map((n) => (
          <li key={n.id} className="border-l-2 border-steel-300 pl-2">
            <p className="text-xs text-ink-muted">
              {n.author ?? 'A former staff member'} ·{' '}
              <span className="spec">{n.createdAt.slice(0, 16).replace('T', ' ')}</span> UTC
            </p>
            <p className="whitespace-pre-line">{n.body}</p>
          </li>
        ))}
      </ol>
      <form
        className="mt-2 flex flex-col gap-1 sm:flex-row sm:items-end"
        onSubmit={(e) => {
          e.preventDefault();
          void add();
        }}
      >
        <label htmlFor={`lead-note-${leadId}`} className="sr-only">
          New note on lead {leadId}
        </label>
        <textarea
          id={`lead-note-${leadId}`}
          rows={2}
          maxLength={LEAD_NOTE_LIMITS.bodyMaxLength}
          placeholder="What was said, and what happens next"
          className="min-w-0 flex-1 rounded border border-steel-300 bg-paper-raised px-2 py-1"
          value={body}
          onChange={(e) => setBody(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) {
              e.preventDefault();
              void add();
            }
          }}
        />
        <Button type="submit" variant="quiet" disabled={saving || !body.trim()}>
          Add note
        </Button>
      </form>
      {message ? (
        <p role="status" className="text-xs text-ink-soft">
          {message}
        </p>
      ) : null}
    </section>
  );
}
