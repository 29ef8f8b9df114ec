'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { SelectControl, TextControl, type Options } from '@/components/ui/field';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { useVersionedSave } from '@/lib/api-client';
import type { BoardJob } from '@/lib/jobs/types';
import { STATE_WORDS, type JobState } from '@/lib/jobs/states';
import { JOB_LIMITS } from '@/lib/schemas/job';
import { jobResult } from './job-api';
import { JobStateTag } from './job-state-tag';

// Booking (day, bay, technician) and the moves the workshop allows from here. Every save sends the
// version this page last read; someone else's newer save answers 409, nothing is overwritten, and their
// booking is shown with the choice to load it or keep the one typed here (saved on top of theirs).
type Staff = { id: number; name: string; role: string };
const BAY_OPTIONS: Options = [
  ['', 'Not set'],
  ...Array.from({ length: JOB_LIMITS.bays }, (_, i) => [String(i + 1), `Bay ${i + 1}`] as const),
];

export function JobProgress({ job, staff }: { job: BoardJob; staff: Staff[] }) {
  const router = useRouter();
  const [bookedFor, setBookedFor] = useState(job.bookedFor ?? '');
  const [bay, setBay] = useState(job.bay === null ? '' : String(job.bay));
  const [technicianId, setTechnicianId] = useState(job.technician ? String(job.technician.id) : '');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const versioned = useVersionedSave<BoardJob>(job);
  // A 409 for a move the workshop does not allow carries the job as this page has it: only a newer one is a conflict.
  const theirs =
    versioned.conflict && versioned.conflict.version !== versioned.base?.version ? versioned.conflict : null;

  async function save(body: Record<string, unknown>, success: string) {
    setBusy(true);
    setProblem(null);
    setDone(null);
    const result = jobResult(await versioned.save('PATCH', `/api/jobs/${job.id}`, body));
    setBusy(false);
    if (!result.ok) return setProblem(result);
    setDone(success);
    router.refresh(); // the page reads the job again (new version, sign-off form, printout)
  }

  const loadTheirs = (newer: BoardJob) => {
    versioned.settle();
    setBookedFor(newer.bookedFor ?? '');
    setBay(newer.bay === null ? '' : String(newer.bay));
    setTechnicianId(newer.technician ? String(newer.technician.id) : '');
    setProblem(null);
    router.refresh();
  };

  const booking = () =>
    save(
      {
        bookedFor: bookedFor || undefined,
        bay: bay ? Number(bay) : null,
        technicianId: technicianId ? Number(technicianId) : null,
      },
      'Booking saved.',
    );
  const moveLabel = (to: JobState) =>
    job.nextStates.indexOf(to) === 0 ? `Move to: ${STATE_WORDS[to]}` : `Back to: ${STATE_WORDS[to]}`;

  return (
    <section aria-labelledby="progress-title" className="rounded border border-steel-300 p-3">
      <h2 id="progress-title" className="flex flex-wrap items-center gap-2 font-semibold">
        Progress <JobStateTag state={job.state} />
      </h2>
      <p className="hidden text-sm print:block">
        Booked for <span className="spec">{job.bookedFor ?? '—'}</span> · bay{' '}
        <span className="spec">{job.bay ?? '—'}</span> · {job.technician?.name ?? 'no technician'}
      </p>
      <form
        aria-label="Booking"
        className="mt-2 flex flex-wrap items-end gap-3 print:hidden"
        onSubmit={(e) => {
          e.preventDefault();
          void booking();
        }}
      >
        <TextControl
          id="job-bookedFor"
          label="Booked for"
          type="date"
          className="spec"
          value={bookedFor}
          onChange={(e) => setBookedFor(e.target.value)}
          disabled={job.state === 'collected'}
          error={problem?.fields.bookedFor}
        />
        <SelectControl
          id="job-bay"
          label="Bay"
          options={BAY_OPTIONS}
          value={bay}
          onChange={(e) => setBay(e.target.value)}
          disabled={job.state === 'collected'}
          error={problem?.fields.bay}
        />
        <SelectControl
          id="job-technician"
          label="Technician"
          options={[
            ['', 'Nobody yet'],
            ...staff.map((s) => [String(s.id), `${s.name}${s.role === 'manager' ? ' (manager)' : ''}`] as const),
          ]}
          value={technicianId}
          onChange={(e) => setTechnicianId(e.target.value)}
          disabled={job.state === 'collected'}
          error={problem?.fields.technicianId}
        />
        <Button type="submit" variant="primary" disabled={busy || Boolean(theirs) || job.state === 'collected'}>
          {job.state === 'not-booked' ? 'Book the job' : 'Save booking'}
        </Button>
      </form>
      {job.state !== 'not-booked' && job.nextStates.length ? (
        <div className="mt-3 flex flex-wrap gap-2 print:hidden" role="group" aria-label="Move the job">
          {job.nextStates.map((to, i) => (
            <Button
              key={to}
              type="button"
              variant={i === 0 ? 'primary' : 'quiet'}
              disabled={busy || Boolean(theirs)}
              onClick={() => void save({ state: to }, `Moved to: ${STATE_WORDS[to]}.`)}
            >
              {moveLabel(to)}
            </Button>
          ))}
        </div>
      ) : null}
      {job.state === 'on-dyno' && !job.signOff ? (
        <p className="mt-2 text-xs text-caution-700 print:hidden">
          Record the sign-off below before the job can be marked ready.
        </p>
      ) : null}
      <div className="mt-2 print:hidden" aria-live="polite">
        {problem ? (
          <Banner tone="fault" title="Not saved">
            {problem.message}
          </Banner>
        ) : null}
        {theirs ? (
          <ConflictBanner
            title="Someone else saved this job while you were looking at it. Nothing was overwritten."
            onTheirs={() => loadTheirs(theirs)}
            onMine={() => {
              versioned.settle();
              setProblem(null);
            }}
            mineLabel="Keep my booking (then save again)"
          >
            Theirs: booked for <span className="spec">{theirs.bookedFor ?? '—'}</span> · bay{' '}
            <span className="spec">{theirs.bay ?? '—'}</span> · {theirs.technician?.name ?? 'no technician'} ·{' '}
            {STATE_WORDS[theirs.state]}.
          </ConflictBanner>
        ) : null}
        {done ? <Banner tone="ok" title={done} /> : null}
      </div>
    </section>
  );
}
