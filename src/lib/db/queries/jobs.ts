import 'server-only';
import { Op } from 'sequelize';
import type { CamCard } from '@/lib/schemas/cam-card';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { Build, Cam, Customer, Quote, QuoteLine } from '../models';
import { camCardOf } from '@/lib/catalogue/cam-card-of';
import { JOB_QUOTE_STATUSES } from './dyno-runs';

// The technician's view of a job: a quote the customer has accepted or paid a deposit on. Never
// carries prices, costs or margins — the workshop needs the parts, not the money.

export type JobSummary = {
  quoteId: number;
  number: string;
  status: string;
  customerName: string;
  vehicleLabel: string;
  buildId: number | null;
  camName: string | null;
  acceptedAt: string | null;
};
export type JobLine = { kind: string; description: string; quantity: number };
export type JobSheet = JobSummary & {
  profile: BuildProfile | null;
  cam: (CamCard & { sku: string; supplierNotes: string | null }) | null;
  lines: JobLine[];
};

type QuoteWithRefs = Quote & { customer?: Customer; build?: Build | null; cam?: Cam | null; lines?: QuoteLine[] };

function summaryOf(q: QuoteWithRefs): JobSummary {
  return {
    quoteId: q.id,
    number: q.number,
    status: q.status,
    customerName: q.customer?.name ?? 'Unknown customer',
    vehicleLabel: q.build?.vehicleLabel ?? 'No build',
    buildId: q.buildId ?? null,
    camName: q.cam ? `${q.cam.sku} ${q.cam.name}` : null,
    acceptedAt: q.acceptedAt ? new Date(q.acceptedAt).toISOString() : null,
  };
}

const refs = () => [
  { model: Customer, as: 'customer', attributes: ['id', 'name'] },
  { model: Build, as: 'build', attributes: ['id', 'vehicleLabel', 'profile'] },
  { model: Cam, as: 'cam' },
];

export async function listJobs(): Promise<JobSummary[]> {
  const quotes = await Quote.findAll({
    where: { status: { [Op.in]: [...JOB_QUOTE_STATUSES] } },
    include: refs(),
    order: [
      ['acceptedAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: 200,
  });
  return quotes.map((q) => summaryOf(q as QuoteWithRefs));
}

export async function getJobSheet(quoteId: number): Promise<JobSheet | null> {
  const quote = (await Quote.findOne({
    // A closed quote (balance paid) keeps its sheet: the board shows the job until the car is collected.
    where: { id: quoteId, status: { [Op.in]: [...JOB_QUOTE_STATUSES, 'closed'] } },
    include: [
      ...refs(),
      { model: QuoteLine, as: 'lines', attributes: ['id', 'kind', 'description', 'quantity', 'sortOrder'] },
    ],
    order: [[{ model: QuoteLine, as: 'lines' }, 'sortOrder', 'ASC']],
  })) as QuoteWithRefs | null;
  if (!quote) return null;
  const parsed = quote.build ? BuildProfileSchema.safeParse(quote.build.profile) : null;
  return {
    ...summaryOf(quote),
    profile: parsed?.success ? parsed.data : null,
    cam: quote.cam ? { ...camCardOf(quote.cam), sku: quote.cam.sku, supplierNotes: quote.cam.notes ?? null } : null,
    lines: (quote.lines ?? []).map((l) => ({ kind: l.kind, description: l.description, quantity: Number(l.quantity) })),
  };
}
