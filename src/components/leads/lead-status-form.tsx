'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { LEAD_STATUSES, type LeadStatus } from '@/lib/schemas/lead';
import { LEAD_STATUS_WORDS } from './lead-status';
import { useVersionedSave } from '@/lib/api-client';

// Moves a lead along with the version it was read at; a stale version (409) shows the status someone else
// saved and lets this person take it or keep their choice (saved on top of theirs with the next Save).
export function LeadStatusForm({ id, status, version }: { id: number; status: LeadStatus; version: number }) {
  const router = useRouter();
  const [value, setValue] = useState<LeadStatus>(status);
  const [message, setMessage] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const { base, conflict, save, settle } = useVersionedSave<{ status: LeadStatus; version: number }>({
    status,
    version,
  });

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setSaving(true);
    setMessage(null);
    const answer = await save('PATCH', `/api/leads/${id}`, { status: value });
    setSaving(false);
    if (answer.ok) setMessage('Saved.');
    else if (answer.status === 0) return setMessage('Not saved: the server could not be reached.');
    else setMessage(answer.body.message ?? `Not saved (${answer.status}).`);
    router.refresh();
  }

  return (
    <form onSubmit={submit} className="flex flex-wrap items-center gap-2 text-sm">
      <label htmlFor={`lead-status-${id}`} className="font-semibold">
        Status
      </label>
      <select
        id={`lead-status-${id}`}
        value={value}
        onChange={(e) => setValue(e.target.value as LeadStatus)}
        className="rounded border border-steel-300 bg-paper-raised px-2 py-1"
      >
        {LEAD_STATUSES.map((s) => (
          <option key={s} value={s}>
            {LEAD_STATUS_WORDS[s]}
          </option>
        ))}
      </select>
      <Button
        type="submit"
        disabled={saving || Boolean(conflict) || value === (base?.status ?? status)}
        variant="quiet"
      >
        {saving ? 'Saving…' : 'Save'}
      </Button>
      {message && !conflict ? <span role="status">{message}</span> : null}
      {conflict ? (
        <ConflictBanner
          title={message ?? 'Someone else changed this lead. Nothing was overwritten.'}
          onTheirs={() => {
            settle();
            setValue(conflict.status);
            setMessage(null);
          }}
          onMine={() => {
            settle();
            setMessage(null);
          }}
          theirsLabel="Take their status"
          mineLabel="Keep mine (then save again)"
        >
          They set it to <strong>{LEAD_STATUS_WORDS[conflict.status]}</strong>; yours is{' '}
          <strong>{LEAD_STATUS_WORDS[value]}</strong>.
        </ConflictBanner>
      ) : null}
    </form>
  );
}
