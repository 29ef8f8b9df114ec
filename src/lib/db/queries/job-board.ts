import 'server-only';
import { Op, type Order, type Transaction, type WhereOptions } from 'sequelize';
import { rolesWith } from '@/lib/auth/policy';
import { readingsOf, signOffWarnings } from '@/lib/jobs/sign-off-limits';
import { nextStates, type BoardState } from '@/lib/jobs/states';
import type { JobListQuery } from '@/lib/schemas/job';
import type { BoardJob, SignOffView } from '@/lib/jobs/types';
import { Build, Cam, Customer, db, Job, JobSignOff, Quote, User } from '../models';

// The job board: every deposit-paid quote is a job. Its booking (date, bay, technician, state) lives in
// `jobs`; a paid quote with no row there is "not booked yet". A quote closed at the counter (balance paid)
// stays a job until the car is collected, so closing never hides a car that is still in the bay. Never carries prices: the workshop needs
// the work, not the money. Jobs are addressed by their quote's id, the same id the job sheet uses.

/** Quote statuses that are jobs: paid, or paid and closed (see src/lib/quotes/lifecycle.ts). */
export const JOB_QUOTE_STATES = ['deposit-paid', 'closed'] as const;

type QuoteRow = Quote & {
  customer?: Customer;
  build?: Build | null;
  cam?: Cam | null;
  job?: (Job & { technician?: User | null }) | null;
};
type SignOffRow = JobSignOff & { signedBy?: User | null };

/** The shop's date today, on the server's clock (run the server in the shop's time zone). */
export function shopToday(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** Overdue: booked before today and not yet ready. Today: booked for today and not yet ready. */
export function dueOf(state: BoardState, bookedFor: string | null, today: string): BoardJob['due'] {
  if (!bookedFor || state === 'ready' || state === 'collected' || state === 'not-booked') return null;
  if (bookedFor < today) return 'overdue';
  return bookedFor === today ? 'today' : null;
}

function signOffView(row: SignOffRow): SignOffView {
  const readings = readingsOf(row);
  // Warnings are worked out on every read, so they always follow the limits in sign-off-limits.ts.
  return {
    ...readings,
    tuneFile: row.tuneFile,
    notes: row.notes,
    signedBy: row.signedBy?.name ?? null,
    signedAt: new Date(row.createdAt).toISOString(),
    warnings: signOffWarnings(readings),
  };
}

export function deactivationActiveOf(build: Build | null | undefined): boolean {
  const engine = (build?.profile as { engine?: { cylinderDeactivation?: unknown } } | undefined)?.engine;
  return engine?.cylinderDeactivation === 'active';
}

function viewOf(q: QuoteRow, today: string, signOff: SignOffRow | null): BoardJob {
  const job = q.job ?? null;
  const state: BoardState = job?.state ?? 'not-booked';
  return {
    id: q.id,
    number: q.number,
    customerName: q.customer?.name ?? 'Unknown customer',
    vehicleLabel: q.build?.vehicleLabel ?? 'No build',
    camName: q.cam ? `${q.cam.sku} ${q.cam.name}` : null,
    state,
    nextStates: nextStates(state),
    bookedFor: job?.bookedFor ?? null,
    bay: job?.bay ?? null,
    technician: job?.technician ? { id: job.technician.id, name: job.technician.name } : null,
    version: job?.version ?? 0,
    stateChangedAt: job ? new Date(job.stateChangedAt).toISOString() : null,
    due: dueOf(state, job?.bookedFor ?? null, today),
    deactivationActive: deactivationActiveOf(q.build),
    signOff: signOff ? signOffView(signOff) : null,
  };
}

const includes = () => [
  { model: Customer, as: 'customer', attributes: ['id', 'name'] },
  { model: Build, as: 'build', attributes: ['id', 'vehicleLabel', 'profile'] },
  { model: Cam, as: 'cam', attributes: ['id', 'sku', 'name'] },
  { model: Job, as: 'job', required: false, include: [{ model: User, as: 'technician', attributes: ['id', 'name'] }] },
];

async function latestSignOffs(jobIds: number[], transaction?: Transaction): Promise<Map<number, SignOffRow>> {
  if (!jobIds.length) return new Map();
  const rows = (await JobSignOff.findAll({
    where: { jobId: { [Op.in]: jobIds } },
    include: [{ model: User, as: 'signedBy', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
    transaction,
  })) as SignOffRow[];
  return new Map(rows.map((r) => [r.jobId, r])); // ascending ids: the newest sign-off per job wins
}

/** One job by its quote id; null when the quote is not a deposit-paid job. */
export async function getBoardJob(quoteId: number, transaction?: Transaction): Promise<BoardJob | null> {
  const q = (await Quote.findOne({
    where: { id: quoteId, status: { [Op.in]: [...JOB_QUOTE_STATES] } },
    include: includes(),
    transaction,
  })) as QuoteRow | null;
  if (!q) return null;
  const signOffs = q.job ? await latestSignOffs([q.job.id], transaction) : new Map();
  return viewOf(q, shopToday(), (q.job && signOffs.get(q.job.id)) ?? null);
}

/**
 * The board, paged. Active view: overdue first, then today's, then paid jobs not booked yet, then the
 * coming days, then jobs ready to collect; within each, by date, then quote id so pages never shuffle.
 */
export async function listBoard(
  query: JobListQuery,
): Promise<{ items: BoardJob[]; total: number; page: number; pageSize: number; today: string }> {
  const sequelize = db();
  const today = shopToday();
  const where: WhereOptions[] = [{ status: { [Op.in]: [...JOB_QUOTE_STATES] } }];
  // Active: paid and not booked yet, or booked and not collected (a closed quote never booked is history).
  if (query.view === 'active')
    where.push({
      [Op.or]: [{ status: 'deposit-paid', '$job.id$': null }, { '$job.state$': { [Op.ne]: 'collected' } }],
    });
  if (query.view === 'collected') where.push({ '$job.state$': 'collected' });
  if (query.from) where.push({ '$job.booked_for$': { [Op.gte]: query.from } });
  if (query.to) where.push({ '$job.booked_for$': { [Op.lte]: query.to } });
  const t = sequelize.escape(today); // our own YYYY-MM-DD, escaped all the same
  const rank = sequelize.literal(
    `CASE WHEN \`job\`.\`id\` IS NULL THEN 2 WHEN \`job\`.\`state\` = 'collected' THEN 5 WHEN \`job\`.\`state\` = 'ready' THEN 4 WHEN \`job\`.\`booked_for\` < ${t} THEN 0 WHEN \`job\`.\`booked_for\` = ${t} THEN 1 ELSE 3 END`,
  );
  // Never name the root table: the production build minifies model class names, and with them its alias.
  const byDate = { model: Job, as: 'job' };
  const order: Order =
    query.view === 'collected'
      ? [
          [byDate, 'bookedFor', 'DESC'],
          ['id', 'DESC'],
        ]
      : [
          [rank, 'ASC'],
          [byDate, 'bookedFor', 'ASC'],
          ['id', 'ASC'],
        ];
  const { rows, count } = await Quote.findAndCountAll({
    where: { [Op.and]: where },
    include: includes(),
    // Only to-one joins: no row multiplication, so the limit can sit on the joined query.
    subQuery: false,
    distinct: true,
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const quotes = rows as QuoteRow[];
  const signOffs = await latestSignOffs(quotes.flatMap((q) => (q.job ? [q.job.id] : [])));
  return {
    items: quotes.map((q) => viewOf(q, today, (q.job && signOffs.get(q.job.id)) ?? null)),
    total: count,
    page: query.page,
    pageSize: query.pageSize,
    today,
  };
}

/** Who a job can be given to: active staff who may record job work (jobs.record: technicians and managers). */
export async function listAssignableStaff(
  transaction?: Transaction,
): Promise<{ id: number; name: string; role: string }[]> {
  const users = await User.findAll({
    where: { active: true, role: { [Op.in]: [...rolesWith('jobs.record')] } },
    attributes: ['id', 'name', 'role'],
    order: [
      ['name', 'ASC'],
      ['id', 'ASC'],
    ],
    transaction,
  });
  return users.map((u) => ({ id: u.id, name: u.name, role: u.role }));
}
