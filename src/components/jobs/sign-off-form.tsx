'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { NumberControl, RadioGroup, TextAreaControl, TextControl } from '@/components/ui/field';
import { submitOnCtrlEnter } from '@/components/ui/keys';
import type { SignOffWarning } from '@/lib/jobs/sign-off-limits';
import { LIMITS_NOTE } from '@/lib/jobs/sign-off-limits';
import { signOffChecks } from '@/lib/forms/sign-off-checks';
import { JOB_LIMITS } from '@/lib/schemas/job';
import { sendJob } from './job-api';
import { READINGS, type ReadingKey } from './sign-off-fields';

// The technician's checks before first start. Numbers are typed as text and sent as numbers; what yup (from
// the schema's limits) or the server refuses shows beside the field. Readings outside the usual limits are saved with a warning.
const asNumber = (v: string) =>
  v.trim() !== '' && Number.isFinite(Number(v)) ? Number(v) : v.trim() === '' ? undefined : v;

export function SignOffForm({ jobId, deactivationActive }: { jobId: number; deactivationActive: boolean }) {
  const router = useRouter();
  const [values, setValues] = useState<Record<ReadingKey, string>>(
    () => Object.fromEntries(READINGS.map((r) => [r.key, ''])) as Record<ReadingKey, string>,
  );
  const [deleteDone, setDeleteDone] = useState<'' | 'yes' | 'no'>('');
  const [tuneFile, setTuneFile] = useState('');
  const [notes, setNotes] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [saved, setSaved] = useState<SignOffWarning[] | null>(null);

  async function submit() {
    setBusy(true);
    setProblem(null);
    setSaved(null);
    const body = {
      ...Object.fromEntries(READINGS.map((r) => [r.key, asNumber(values[r.key])])),
      ...(deactivationActive && deleteDone ? { deactivationDeleteDone: deleteDone === 'yes' } : {}),
      tuneFile,
      ...(notes.trim() ? { notes } : {}),
    };
    // yup from the schema's limits, in the route's words (lib/forms/sign-off-checks.ts); the route re-checks with zod.
    const fields = signOffChecks(body);
    if (Object.keys(fields).length > 0) {
      setBusy(false);
      return setProblem({ message: 'Some fields need attention.', fields });
    }
    const result = await sendJob(`/api/jobs/${jobId}/sign-off`, 'POST', body);
    setBusy(false);
    if (!result.ok) return setProblem(result);
    setSaved(result.job.signOff?.warnings ?? []);
    router.refresh();
  }

  return (
    <form
      aria-label="Sign-off before first start"
      className="flex flex-col gap-3 rounded border border-steel-300 p-3 print:hidden"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      onKeyDown={submitOnCtrlEnter(submit)}
    >
      <h3 className="font-semibold">Record the sign-off</h3>
      <p className="text-xs text-ink-muted">{LIMITS_NOTE}</p>
      <div className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
        {READINGS.map((r) => (
          <NumberControl
            key={r.key}
            id={`sign-off-${r.key}`}
            label={`${r.label} (${r.unit})`}
            unit={r.unit}
            hint={`Usual: ${r.usual}`}
            error={problem?.fields[r.key]}
            value={values[r.key]}
            onChange={(e) => setValues({ ...values, [r.key]: e.target.value })}
          />
        ))}
      </div>
      {deactivationActive ? (
        <RadioGroup
          name="deactivation"
          legend="Cylinder deactivation delete (this build has it working)"
          row
          options={
            [
              ['yes', 'Delete done'],
              ['no', 'Left in place'],
            ] as const
          }
          value={deleteDone}
          onChange={setDeleteDone}
          error={problem?.fields.deactivationDeleteDone}
        />
      ) : null}
      <TextControl
        id="sign-off-tuneFile"
        label="Tune file and version"
        maxLength={JOB_LIMITS.tuneFileMaxLength}
        error={problem?.fields.tuneFile}
        value={tuneFile}
        onChange={(e) => setTuneFile(e.target.value)}
      />
      <TextAreaControl
        id="sign-off-notes"
        label="Notes"
        rows={2}
        maxLength={JOB_LIMITS.notesMaxLength}
        error={problem?.fields.notes}
        value={notes}
        onChange={(e) => setNotes(e.target.value)}
      />
      <div>
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? 'Saving…' : 'Record the sign-off'}
        </Button>
        <span className="ml-2 text-xs text-ink-muted">Ctrl+Enter records from any field.</span>
      </div>
      <div aria-live="polite">
        {problem ? (
          <Banner tone="fault" title="Sign-off not recorded">
            {problem.message}
          </Banner>
        ) : null}
        {saved && saved.length === 0 ? <Banner tone="ok" title="Sign-off recorded." /> : null}
        {saved && saved.length > 0 ? (
          <Banner tone="caution" title="Sign-off recorded, with warnings">
            <ul className="list-disc pl-5">
              {saved.map((w) => (
                <li key={w.field + w.message}>{w.message}</li>
              ))}
            </ul>
          </Banner>
        ) : null}
      </div>
    </form>
  );
}
