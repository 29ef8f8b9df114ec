import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader, StateTag, tableClass, tdClass, thClass } from '@/components/catalogue/ui';
import { requireRoleForPage } from '@/lib/auth/guard';
import { listJobs } from '@/lib/db/queries/jobs';

export const metadata: Metadata = { title: 'Jobs' };

const STATUS_WORDS: Record<string, string> = { 'deposit-paid': 'Deposit paid', accepted: 'Accepted' };

export default async function JobsPage() {
  await requireRoleForPage('tech', 'manager');
  const jobs = await listJobs();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Jobs" lead="Cam swaps the customer has accepted or paid a deposit on: the build sheet, the parts and the dyno runs." />
      {jobs.length === 0 ? (
        <p className="text-sm text-ink-soft">No accepted jobs right now.</p>
      ) : (
        <table className={tableClass}>
          <caption className="sr-only">Accepted and deposit-paid jobs</caption>
          <thead>
            <tr>
              <th scope="col" className={thClass}>Quote</th>
              <th scope="col" className={thClass}>State</th>
              <th scope="col" className={thClass}>Customer</th>
              <th scope="col" className={thClass}>Vehicle</th>
              <th scope="col" className={thClass}>Cam going in</th>
              <th scope="col" className={thClass}>Accepted</th>
            </tr>
          </thead>
          <tbody>
            {jobs.map((job) => (
              <tr key={job.quoteId} className="border-t border-steel-100">
                <td className={tdClass}>
                  <Link href={`/jobs/${job.quoteId}`} className="spec font-semibold text-gauge-700 underline-offset-2 hover:underline">{job.number}</Link>
                </td>
                <td className={tdClass}><StateTag tone={job.status === 'deposit-paid' ? 'ok' : 'muted'}>{STATUS_WORDS[job.status] ?? job.status}</StateTag></td>
                <td className={tdClass}>{job.customerName}</td>
                <td className={tdClass}>{job.vehicleLabel}</td>
                <td className={`${tdClass} spec`}>{job.camName ?? '—'}</td>
                <td className={`${tdClass} spec`}>{job.acceptedAt ? job.acceptedAt.slice(0, 10) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
