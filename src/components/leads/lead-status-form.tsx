'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { LEAD_STATUSES, type LeadStatus } from '@/lib/schemas/lead';
import { LEAD_STATUS_WORDS } from './lead-status';
import { sendJson } from '@/lib/api-client';

// Moves a lead along with the version it was read at; a stale version (409) says so and reloads.
export function LeadStatusForm({ id, status, version }: { id: number; status: LeadStatus; version: number }) {
  const router = useRouter();
  const [value, setValue] = useState<LeadStatus>(status);
  const [message, setMessage] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setSaving(true);
    setMessage(null);
    const answer = await sendJson('PATCH', `/api/leads/${id}`, { version, status: value });
    setSaving(false);
    if (answer.ok) setMessage('Saved.');
    else if (answer.status === 0) return setMessage('Not saved: the server could not be reached.');
    else setMessage(answer.body.message ?? `Not saved (${answer.status}).`);
    router.refresh();
  }

  return (
    <form onSubmit={save} className="flex flex-wrap items-center gap-2 text-sm">
      <label htmlFor={`lead-status-${id}`} className="font-semibold">Status</label>
      <select id={`lead-status-${id}`} value={value} onChange={(e) => setValue(e.target.value as LeadStatus)} className="rounded border border-steel-300 bg-paper-raised px-2 py-1">
        {LEAD_STATUSES.map((s) => <option key={s} value={s}>{LEAD_STATUS_WORDS[s]}</option>)}
      </select>
      <Button type="submit" disabled={saving || value === status} variant="quiet">{saving ? 'Saving…' : 'Save'}</Button>
      {message ? <span role="status">{message}</span> : null}
    </form>
  );
}
