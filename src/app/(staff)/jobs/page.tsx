import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { BoardList } from '@/components/jobs/board-list';
import { BoardWeek } from '@/components/jobs/board-week';
import { dayLabel } from '@/components/jobs/job-state-tag';
import { requireAccessForPage } from '@/lib/auth/guard';
import { listBoard, shopToday } from '@/lib/db/queries/job-board';
import { addDays, mondayOf, weekDays } from '@/lib/jobs/week';
import { BoardPageQuerySchema } from '@/lib/schemas/job';

export const metadata: Metadata = { title: 'Jobs' };

const PAGE_SIZE = 50;
const tab = (active: boolean) =>
  `rounded px-2.5 py-1 text-sm font-semibold ${active ? 'bg-ink text-paper-raised' : 'bg-paper-raised text-ink ring-1 ring-steel-300 hover:ring-gauge-500'}`;

export default async function JobsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  await requireAccessForPage('jobs.read');
  const q = BoardPageQuerySchema.parse(await searchParams);
  const today = shopToday();
  const monday = mondayOf(q.week ?? today);
  const days = weekDays(monday);
  const board =
    q.view === 'week'
      ? await listBoard({ view: 'all', from: days[0], to: days[6], page: 1, pageSize: 100 })
      : await listBoard({ view: q.show, page: q.page, pageSize: PAGE_SIZE });
  const waiting =
    q.view === 'week'
      ? (await listBoard({ view: 'active', page: 1, pageSize: 100 })).items.filter((j) => j.state === 'not-booked')
      : [];
  const pages = Math.max(1, Math.ceil(board.total / PAGE_SIZE));

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Jobs"
        lead="Paid cam swaps: book a day, a bay and a technician, then move each job along. Overdue and today's jobs come first."
      />
      <nav aria-label="Board views" className="flex flex-wrap items-center gap-2">
        <Link
          href="/jobs"
          className={tab(q.view === 'list' && q.show === 'active')}
          aria-current={q.view === 'list' && q.show === 'active' ? 'page' : undefined}
        >
          List
        </Link>
        <Link
          href="/jobs?view=week"
          className={tab(q.view === 'week')}
          aria-current={q.view === 'week' ? 'page' : undefined}
        >
          Week
        </Link>
        <Link
          href="/jobs?show=collected"
          className={tab(q.view === 'list' && q.show === 'collected')}
          aria-current={q.show === 'collected' ? 'page' : undefined}
        >
          Collected
        </Link>
      </nav>

      {q.view === 'week' ? (
        <>
          <div className="flex flex-wrap items-center gap-3 text-sm">
            <Link
              href={`/jobs?view=week&week=${addDays(monday, -7)}`}
              className="text-gauge-700 underline-offset-2 hover:underline"
            >
              ← Previous week
            </Link>
            <h2 className="font-semibold">Week of {dayLabel(monday)}</h2>
            <Link
              href={`/jobs?view=week&week=${addDays(monday, 7)}`}
              className="text-gauge-700 underline-offset-2 hover:underline"
            >
              Next week →
            </Link>
          </div>
          <BoardWeek days={days} jobs={board.items} today={today} />
          {waiting.length ? (
            <section aria-labelledby="waiting-title">
              <h2 id="waiting-title" className="font-semibold">
                Paid, not booked yet ({waiting.length})
              </h2>
              <BoardList jobs={waiting} />
            </section>
          ) : null}
        </>
      ) : board.items.length === 0 ? (
        <p className="text-sm text-ink-soft">
          {q.show === 'collected' ? 'No collected jobs yet.' : 'No paid jobs waiting right now.'}
        </p>
      ) : (
        <>
          <BoardList jobs={board.items} />
          {pages > 1 ? (
            <nav aria-label="Pages" className="flex gap-3 text-sm">
              {q.page > 1 ? (
                <Link href={`/jobs?show=${q.show}&page=${q.page - 1}`} className="text-gauge-700 underline">
                  ← Previous
                </Link>
              ) : null}
              <span className="spec">
                Page {q.page} of {pages}
              </span>
              {q.page < pages ? (
                <Link href={`/jobs?show=${q.show}&page=${q.page + 1}`} className="text-gauge-700 underline">
                  Next →
                </Link>
              ) : null}
            </nav>
          ) : null}
        </>
      )}
    </div>
  );
}
