import Link from 'next/link';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import type { BoardJob } from '@/lib/jobs/types';
import { dayLabel, DueTag, JobStateTag } from './job-state-tag';

// The board as a list: overdue and today's jobs first (the query's order). Dense; on a phone the
// customer and cam columns fold away and the rest scroll inside the table's own box.
export function BoardList({ jobs }: { jobs: BoardJob[] }) {
  return (
    <div className="overflow-x-auto">
      <table className={tableClass}>
        <caption className="sr-only">Jobs, overdue and today&apos;s first</caption>
        <thead>
          <tr>
            <th scope="col" className={thClass}>
              Job
            </th>
            <th scope="col" className={thClass}>
              State
            </th>
            <th scope="col" className={thClass}>
              Booked for
            </th>
            <th scope="col" className={`${thClass} text-right`}>
              Bay
            </th>
            <th scope="col" className={thClass}>
              Technician
            </th>
            <th scope="col" className={thClass}>
              Vehicle
            </th>
            <th scope="col" className={`${thClass} hidden md:table-cell`}>
              Customer
            </th>
            <th scope="col" className={`${thClass} hidden lg:table-cell`}>
              Cam going in
            </th>
          </tr>
        </thead>
        <tbody>
          {jobs.map((job) => (
            <tr key={job.id} data-job={job.number}>
              <td className={tdClass}>
                <Link
                  href={`/jobs/${job.id}`}
                  className="spec font-semibold text-gauge-700 underline-offset-2 hover:underline"
                >
                  {job.number}
                </Link>
              </td>
              <td className={tdClass}>
                <JobStateTag state={job.state} />
              </td>
              <td className={`${tdClass} whitespace-nowrap`}>
                {job.bookedFor ? <span className="spec">{dayLabel(job.bookedFor)}</span> : '—'} <DueTag due={job.due} />
              </td>
              <td className={`${tdClass} spec text-right`}>{job.bay ?? '—'}</td>
              <td className={tdClass}>{job.technician?.name ?? '—'}</td>
              <td className={tdClass}>{job.vehicleLabel}</td>
              <td className={`${tdClass} hidden md:table-cell`}>{job.customerName}</td>
              <td className={`${tdClass} spec hidden lg:table-cell`}>{job.camName ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
