import 'server-only';
import { Op, type Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, invalid, notFound, refused, runWrite, type WriteOutcome } from '@/lib/db/write';
import { readingsOf, signOffWarnings } from '@/lib/jobs/sign-off-limits';
import {
  canMove,
  illegalMoveMessage,
  SIGN_OFF_STATES,
  STATE_WORDS,
  type BoardState,
  type JobState,
} from '@/lib/jobs/states';
import { SIGN_OFF_WORDS, type JobPatch, type SignOffInput } from '@/lib/schemas/job';
import { Build, Job, JobSignOff, Quote } from '../models';
import type { BoardJob } from '@/lib/jobs/types';
import { deactivationActiveOf, getBoardJob, JOB_QUOTE_STATES, listAssignableStaff } from './job-board';

// Writes to the board. Each locks the quote row first (then the job row), so two people booking the same
// freshly paid job queue instead of racing to create two bookings, and every write carries its audit row.

async function lockPaidJob(quoteId: number, t: Transaction): Promise<{ quote: Quote; job: Job | null }> {
  const quote = await Quote.findOne({
    where: { id: quoteId, status: { [Op.in]: [...JOB_QUOTE_STATES] } },
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  if (!quote) throw notFound();
  const job = await Job.findOne({ where: { quoteId }, transaction: t, lock: t.LOCK.UPDATE });
  return { quote, job };
}

async function current(quoteId: number, t: Transaction): Promise<BoardJob> {
  const view = await getBoardJob(quoteId, t);
  if (!view) throw notFound();
  return view;
}

/** Booking date, bay, technician and state, with the version last read (0 before the first booking). */
export async function updateJob(
  quoteId: number,
  patch: JobPatch,
  user: SessionUser,
  ip: string | null,
): Promise<WriteOutcome<BoardJob>> {
  return runWrite(
    async (t) => {
      const { job } = await lockPaidJob(quoteId, t);
      if (patch.version !== (job?.version ?? 0)) throw conflict(await current(quoteId, t));
      const from: BoardState = job?.state ?? 'not-booked';
      const to = patch.state;
      if (to && !canMove(from, to)) throw refused(illegalMoveMessage(from, to));
      if (from === 'collected') throw refused('This job is collected (collected); its booking can no longer change.');
      if (!job && !patch.bookedFor)
        throw invalid([{ field: 'bookedFor', message: 'bookedFor is required: a job is booked for a date first' }]);
      if (
        to === 'ready' &&
        from !== 'ready' &&
        job &&
        (await JobSignOff.count({ where: { jobId: job.id }, transaction: t })) === 0
      ) {
        throw refused(
          `This job is ${STATE_WORDS[from].toLowerCase()} (${from}) and has no sign-off: record the technician's sign-off before marking it ready.`,
        );
      }
      if (patch.technicianId) {
        const staff = await listAssignableStaff(t);
        if (!staff.some((s) => s.id === patch.technicianId))
          throw invalid([{ field: 'technicianId', message: 'technicianId must be an active technician or manager' }]);
      }

      const changes = {
        ...(patch.bookedFor !== undefined ? { bookedFor: patch.bookedFor } : {}),
        ...(patch.bay !== undefined ? { bay: patch.bay } : {}),
        ...(patch.technicianId !== undefined ? { technicianUserId: patch.technicianId } : {}),
        ...(to !== undefined && to !== from ? { state: to, stateChangedAt: new Date() } : {}),
      };
      if (!job) {
        const made = await Job.create(
          {
            quoteId,
            bookedFor: patch.bookedFor!,
            bay: patch.bay ?? null,
            technicianUserId: patch.technicianId ?? null,
            state: 'booked',
          },
          { transaction: t },
        );
        await recordAudit(
          {
            user,
            action: 'job.booked',
            entityType: 'job',
            entityId: made.id,
            after: { quoteId, ...changes, state: 'booked' },
            ip,
          },
          t,
        );
        return { record: await current(quoteId, t) };
      }
      const fields = Object.keys(changes).filter((k) => k !== 'stateChangedAt') as (keyof typeof changes & keyof Job)[];
      const before = Object.fromEntries(fields.map((k) => [k, job.get(k) ?? null]));
      if (!fields.some((k) => JSON.stringify(before[k]) !== JSON.stringify(changes[k] ?? null)))
        return { record: await current(quoteId, t), changed: false };
      job.set(changes);
      await job.save({ transaction: t });
      const action = 'state' in changes ? 'job.state-changed' : 'job.rebooked';
      await recordAudit({ user, action, entityType: 'job', entityId: job.id, before, after: changes, ip }, t);
      return { record: await current(quoteId, t) };
    },
    { reload: () => getBoardJob(quoteId) },
  );
}

/** The technician's checks before first start; the newest sign-off is the one that counts. */
export async function recordSignOff(
  quoteId: number,
  input: SignOffInput,
  user: SessionUser,
  ip: string | null,
): Promise<WriteOutcome<BoardJob>> {
  return runWrite(async (t) => {
    const { quote, job } = await lockPaidJob(quoteId, t);
    if (!job)
      throw refused('This job is not booked yet (not-booked): book it and bring it into the shop before the sign-off.');
    const state = job.state as JobState;
    if (!SIGN_OFF_STATES.includes(state)) {
      throw refused(
        `This job is ${STATE_WORDS[state].toLowerCase()} (${state}); the sign-off is recorded while it is in the shop or on the dyno.`,
      );
    }
    const build = quote.buildId
      ? await Build.findByPk(quote.buildId, { attributes: ['id', 'profile'], transaction: t })
      : null;
    const asked = deactivationActiveOf(build);
    if (asked && input.deactivationDeleteDone === undefined) {
      throw invalid([
        {
          field: 'deactivationDeleteDone',
          message: `${SIGN_OFF_WORDS.deactivationDeleteDone} is required: this build has active cylinder deactivation`,
        },
      ]);
    }
    const readings = readingsOf({ ...input, deactivationDeleteDone: asked ? input.deactivationDeleteDone! : null });
    const row = await JobSignOff.create(
      { jobId: job.id, ...readings, tuneFile: input.tuneFile, notes: input.notes ?? null, signedByUserId: user.id },
      { transaction: t },
    );
    await recordAudit(
      {
        user,
        action: 'job.signed-off',
        entityType: 'job',
        entityId: job.id,
        after: {
          signOffId: row.id,
          ...readings,
          tuneFile: input.tuneFile,
          warnings: signOffWarnings(readings).map((w) => w.field),
        },
        ip,
      },
      t,
    );
    return { record: await current(quoteId, t) };
  });
}
