import Link from 'next/link';
import type { BoardJob } from '@/lib/jobs/types';
import { dayLabel, DueTag, JobStateTag } from './job-state-tag';

// Seven days from Monday, one column each (stacked on a phone), each job a small card.
export function BoardWeek({ days, jobs, today }: { days: string[]; jobs: BoardJob[]; today: string }) {
  return (
    <ol className="grid grid-cols-1 gap-2 md:grid-cols-7" aria-label="The week's bookings">
      {days.map((day) => {
        const booked = jobs.filter((j) => j.bookedFor === day);
        return (
          <li
            key={day}
            className={`min-w-0 rounded border p-2 ${day === today ? 'border-ember-500' : 'border-steel-300'}`}
            aria-label={dayLabel(day)}
          >
            <p className="text-xs font-semibold uppercase tracking-wide text-ink-muted">
              {dayLabel(day)} {day === today ? <span className="text-ember-600">· Today</span> : null}
            </p>
            {booked.length === 0 ? <p className="text-xs text-ink-muted">Nothing booked</p> : null}
            <ul className="mt-1 flex flex-col gap-1">
              {booked.map((job) => (
                <li key={job.id} className="rounded bg-paper-raised p-1.5 text-xs ring-1 ring-steel-100">
                  <Link
                    href={`/jobs/${job.id}`}
                    className="spec font-semibold text-gauge-700 underline-offset-2 hover:underline"
                  >
                    {job.number}
                  </Link>{' '}
                  <JobStateTag state={job.state} /> <DueTag due={job.due} />
                  <p className="truncate">{job.vehicleLabel}</p>
                  <p className="text-ink-muted">
                    Bay <span className="spec">{job.bay ?? '—'}</span> · {job.technician?.name ?? 'nobody yet'}
                  </p>
                </li>
              ))}
            </ul>
          </li>
        );
      })}
    </ol>
  );
}
