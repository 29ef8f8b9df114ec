import { Op } from 'sequelize';
import { AuditEntry, Job, User } from '@/lib/db/models';
import type { BoardJob } from '@/lib/jobs/types';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makePaidJob, shopDay } from '../support/job-fixtures';
import { makeSentQuote } from '../support/quote-fixtures';

// The job board over HTTP (issue 9, items 2 and 3): paid quotes become jobs, bookings carry a version,
// the workshop's states move one step at a time, and "ready" needs the technician's sign-off. Each test
// pays for its own fixture jobs; their bookings are removed afterwards.
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let counter: Agent;
let tech: Agent;
let techId: number;
let counterId: number;
const mine: number[] = [];

// Readings inside every usual limit (sign-off-limits.ts), for a build with active cylinder deactivation.
const GOOD_SIGN_OFF = {
  ptvIntakeIn: 0.095,
  ptvExhaustIn: 0.12,
  springInstalledHeightIn: 1.8,
  springSeatPressureLb: 135,
  coilBindMarginIn: 0.08,
  pushrodLengthIn: 7.4,
  lifterPreloadIn: 0.06,
  deactivationDeleteDone: true,
  tuneFile: 'fixture-tune v3',
};

async function paid(label: string) {
  const quote = await makePaidJob(counter, label);
  mine.push(quote.id);
  return quote;
}

async function book(id: number, days: number, extra: Record<string, unknown> = {}) {
  const res = await tech.patch(`/api/jobs/${id}`).send({ version: 0, bookedFor: shopDay(days), ...extra });
  expect(res.status).toBe(200);
  return res.body as { version: number; state: string };
}

async function move(id: number, version: number, state: string) {
  return tech.patch(`/api/jobs/${id}`).send({ version, state });
}

beforeAll(async () => {
  connectTestDatabase();
  [counter, tech] = await Promise.all([signedInAgent('counter'), signedInAgent('tech')]);
  techId = (await User.findOne({ where: { email: 'tech@lobewise.test' } }))!.id;
  counterId = (await User.findOne({ where: { email: 'counter@lobewise.test' } }))!.id;
}, 60_000);
afterAll(async () => {
  const jobs = await Job.findAll({ where: { quoteId: { [Op.in]: mine } } });
  await AuditEntry.destroy({ where: { entityType: 'job', entityId: { [Op.in]: jobs.map((j) => String(j.id)) } } });
  await Job.destroy({ where: { id: { [Op.in]: jobs.map((j) => j.id) } } });
  await disconnectTestDatabase();
});

describe('booking a paid job', () => {
  it('a paid quote is on the board, not booked yet; an unpaid one is not a job', async () => {
    const job = await paid('Board newly paid');
    const listed = (await tech.get('/api/jobs').query({ pageSize: 100 })).body.items as BoardJob[];
    expect(listed.find((j) => j.id === job.id)).toMatchObject({ state: 'not-booked', version: 0 });
    const one = await tech.get(`/api/jobs/${job.id}`);
    expect(one.status).toBe(200);
    expect(one.body).toMatchObject({
      number: job.number,
      state: 'not-booked',
      nextStates: ['booked'],
      deactivationActive: true,
      signOff: null,
    });
    expect(JSON.stringify(one.body)).not.toMatch(/Cents/); // the workshop's view carries no money

    const unpaid = await makeSentQuote(counter, 'Board unpaid');
    expect((await tech.get(`/api/jobs/${unpaid.id}`)).status).toBe(404);
    expect((await tech.patch(`/api/jobs/${unpaid.id}`).send({ version: 0, bookedFor: shopDay(1) })).status).toBe(404);
  }, 60_000);

  it('books a date, bay and technician with version 0, audits it, and refuses a stale or bad save', async () => {
    const job = await paid('Board booking');
    const noDate = await tech.patch(`/api/jobs/${job.id}`).send({ version: 0, bay: 2 });
    expect(noDate.status).toBe(422);
    expect(noDate.body.errors).toEqual([expect.objectContaining({ field: 'bookedFor' })]);
    const badBay = await tech.patch(`/api/jobs/${job.id}`).send({ version: 0, bookedFor: shopDay(3), bay: 99 });
    expect(badBay.status).toBe(422);
    expect(badBay.body.errors).toEqual([expect.objectContaining({ field: 'bay' })]);
    const badTech = await tech
      .patch(`/api/jobs/${job.id}`)
      .send({ version: 0, bookedFor: shopDay(3), technicianId: counterId });
    expect(badTech.status).toBe(422);
    expect(badTech.body.errors).toEqual([expect.objectContaining({ field: 'technicianId' })]);
    const badDate = await tech.patch(`/api/jobs/${job.id}`).send({ version: 0, bookedFor: '2026-02-30' });
    expect(badDate.status).toBe(422);
    expect(badDate.body.errors).toEqual([expect.objectContaining({ field: 'bookedFor' })]);

    const booked = await tech
      .patch(`/api/jobs/${job.id}`)
      .send({ version: 0, bookedFor: shopDay(3), bay: 2, technicianId: techId });
    expect(booked.status).toBe(200);
    expect(booked.body).toMatchObject({
      state: 'booked',
      version: 1,
      bookedFor: shopDay(3),
      bay: 2,
      technician: { id: techId },
    });
    const row = await Job.findOne({ where: { quoteId: job.id } });
    expect(row).toMatchObject({ state: 'booked', bay: 2, technicianUserId: techId, bookedFor: shopDay(3) });
    expect(
      await AuditEntry.count({ where: { action: 'job.booked', entityType: 'job', entityId: String(row!.id) } }),
    ).toBe(1);

    // Someone else's screen still says version 0: their save must not overwrite the booking.
    const stale = await tech.patch(`/api/jobs/${job.id}`).send({ version: 0, bookedFor: shopDay(5) });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ version: 1, bookedFor: shopDay(3) });
    const moved = await tech.patch(`/api/jobs/${job.id}`).send({ version: 1, bookedFor: shopDay(4), bay: null });
    expect(moved.body).toMatchObject({ version: 2, bookedFor: shopDay(4), bay: null });
  }, 60_000);
});

describe('moving a job through the workshop', () => {
  it('goes one step at a time, refuses illegal moves with 409 naming the current state, and needs a sign-off for ready', async () => {
    const job = await paid('Board states');
    const unbooked = await move(job.id, 0, 'in-shop');
    expect(unbooked.status).toBe(409);
    expect(unbooked.body.message).toContain('not booked yet (not-booked)');

    let v = (await book(job.id, 0)).version;
    const skip = await move(job.id, v, 'ready');
    expect(skip.status).toBe(409);
    expect(skip.body.message).toContain('This job is booked (booked)');
    expect(skip.body.current).toMatchObject({ state: 'booked', version: v });
    const bogus = await move(job.id, v, 'finished');
    expect(bogus.status).toBe(422);
    expect(bogus.body.errors).toEqual([expect.objectContaining({ field: 'state' })]);

    for (const state of ['in-shop', 'on-dyno']) {
      const res = await move(job.id, v, state);
      expect(res.status).toBe(200);
      expect(res.body.state).toBe(state);
      v = res.body.version;
    }
    const noSignOff = await move(job.id, v, 'ready');
    expect(noSignOff.status).toBe(409);
    expect(noSignOff.body.message).toMatch(/on the dyno \(on-dyno\) and has no sign-off/);
    expect((await Job.findOne({ where: { quoteId: job.id } }))!.state).toBe('on-dyno');

    expect((await tech.post(`/api/jobs/${job.id}/sign-off`).send(GOOD_SIGN_OFF)).status).toBe(201);
    const ready = await move(job.id, v, 'ready');
    expect(ready.status).toBe(200);
    expect(ready.body).toMatchObject({ state: 'ready', nextStates: ['collected', 'on-dyno'] });
    const collected = await move(job.id, ready.body.version, 'collected');
    expect(collected.body.state).toBe('collected');
    const after = await move(job.id, collected.body.version, 'in-shop');
    expect(after.status).toBe(409);
    expect(after.body.message).toContain('This job is collected (collected)');
    const rebook = await tech.patch(`/api/jobs/${job.id}`).send({ version: collected.body.version, bay: 3 });
    expect(rebook.status).toBe(409);
    const audits = await AuditEntry.findAll({
      where: {
        action: 'job.state-changed',
        entityType: 'job',
        entityId: String((await Job.findOne({ where: { quoteId: job.id } }))!.id),
      },
    });
    expect(audits.map((a) => (a.after as { state: string }).state)).toEqual([
      'in-shop',
      'on-dyno',
      'ready',
      'collected',
    ]);
  }, 60_000);
});

describe("the technician's sign-off", () => {
  it('is taken only in the shop or on the dyno, asks about the deactivation delete, and warns against the usual limits', async () => {
    const job = await paid('Board sign-off');
    const v = (await book(job.id, 1)).version;
    const early = await tech.post(`/api/jobs/${job.id}/sign-off`).send(GOOD_SIGN_OFF);
    expect(early.status).toBe(409);
    expect(early.body.message).toContain('This job is booked (booked)');
    expect((await move(job.id, v, 'in-shop')).status).toBe(200);

    const { deactivationDeleteDone: _left, ...withoutDelete } = GOOD_SIGN_OFF;
    void _left;
    const missing = await tech.post(`/api/jobs/${job.id}/sign-off`).send(withoutDelete);
    expect(missing.status).toBe(422);
    expect(missing.body.errors).toEqual([expect.objectContaining({ field: 'deactivationDeleteDone' })]);
    const impossible = await tech
      .post(`/api/jobs/${job.id}/sign-off`)
      .send({ ...GOOD_SIGN_OFF, ptvIntakeIn: 2, springSeatPressureLb: 'lots', tuneFile: 'a\nb' });
    expect(impossible.status).toBe(422);
    expect(impossible.body.errors.map((e: { field: string }) => e.field).sort()).toEqual([
      'ptvIntakeIn',
      'springSeatPressureLb',
      'tuneFile',
    ]);

    const clean = await tech.post(`/api/jobs/${job.id}/sign-off`).send(GOOD_SIGN_OFF);
    expect(clean.status).toBe(201);
    expect(clean.body.signOff).toMatchObject({
      ptvIntakeIn: 0.095,
      tuneFile: 'fixture-tune v3',
      deactivationDeleteDone: true,
      signedBy: expect.any(String),
      warnings: [],
    });

    // Intake 0.070" (< 0.080"), exhaust 0.090" (< 0.100"), coil bind 0.050" (< 0.060"), delete not done.
    const tight = await tech.post(`/api/jobs/${job.id}/sign-off`).send({
      ...GOOD_SIGN_OFF,
      ptvIntakeIn: 0.07,
      ptvExhaustIn: 0.09,
      coilBindMarginIn: 0.05,
      deactivationDeleteDone: false,
    });
    expect(tight.status).toBe(201);
    expect(tight.body.signOff.warnings.map((w: { field: string }) => w.field)).toEqual([
      'ptvIntakeIn',
      'ptvExhaustIn',
      'coilBindMarginIn',
      'deactivationDeleteDone',
    ]);
    expect(tight.body.signOff.warnings[0].message).toContain('0.070 in is under the usual 0.080 in minimum');
    // The newest sign-off is the one the job shows; the page and the sheet read the same.
    expect((await tech.get(`/api/jobs/${job.id}`)).body.signOff.ptvIntakeIn).toBe(0.07);
    const sheet = await tech.get(`/jobs/${job.id}`);
    expect(sheet.text).toContain('fixture-tune v3');
    expect(sheet.text).toContain('under the usual 0.080 in minimum');
    expect(
      await AuditEntry.count({
        where: {
          action: 'job.signed-off',
          entityType: 'job',
          entityId: String((await Job.findOne({ where: { quoteId: job.id } }))!.id),
        },
      }),
    ).toBe(2);
  }, 60_000);
});

describe('a job whose quote is closed at the counter', () => {
  it('stays on the board until the car is collected', async () => {
    const job = await paid('Board closed quote');
    let v = (await book(job.id, 1)).version;
    v = (await move(job.id, v, 'in-shop')).body.version;
    // The balance taken at the counter closes the quote (a hand close is refused while money is due).
    const quote = (await counter.get(`/api/quotes/${job.id}`)).body as { version: number; balanceDueCents: number };
    const closed = await counter
      .post(`/api/quotes/${job.id}/payments`)
      .send({ version: quote.version, amountCents: quote.balanceDueCents, method: 'cash' });
    expect([closed.status, closed.body.status]).toEqual([201, 'closed']);
    const active = async () =>
      ((await tech.get('/api/jobs').query({ pageSize: 100 })).body.items as { id: number }[]).map((j) => j.id);
    expect(await active()).toContain(job.id);
    expect((await tech.get(`/api/jobs/${job.id}`)).body.state).toBe('in-shop');
    const sheet = await tech.get(`/jobs/${job.id}`);
    expect(sheet.status).toBe(200);
    expect(sheet.text).toContain('Balance paid, closed');
    v = (await move(job.id, v, 'on-dyno')).body.version;
    expect((await tech.post(`/api/jobs/${job.id}/sign-off`).send(GOOD_SIGN_OFF)).status).toBe(201);
    v = (await move(job.id, v, 'ready')).body.version;
    expect((await move(job.id, v, 'collected')).status).toBe(200);
    expect(await active()).not.toContain(job.id);
    const history = (await tech.get('/api/jobs').query({ view: 'collected', pageSize: 100 })).body.items as BoardJob[];
    expect(history.map((j) => j.id)).toContain(job.id);
  }, 60_000);
});

describe('the board order', () => {
  it('puts overdue first, then today, then not booked, then the coming days; pages are stable', async () => {
    const [later, today, overdue, waiting] = [
      await paid('Board later'),
      await paid('Board today'),
      await paid('Board overdue'),
      await paid('Board waiting'),
    ];
    await book(later.id, 2);
    await book(today.id, 0);
    await book(overdue.id, -2);
    const all = (await tech.get('/api/jobs').query({ pageSize: 100 })).body as { items: BoardJob[]; total: number };
    const at = (id: number) => all.items.findIndex((j) => j.id === id);
    expect([at(overdue.id), at(today.id), at(waiting.id), at(later.id)].every((i) => i >= 0)).toBe(true);
    expect(at(overdue.id)).toBeLessThan(at(today.id));
    expect(at(today.id)).toBeLessThan(at(waiting.id));
    expect(at(waiting.id)).toBeLessThan(at(later.id));
    expect(all.items[at(overdue.id)].due).toBe('overdue');
    expect(all.items[at(today.id)].due).toBe('today');
    expect(all.items[at(later.id)].due).toBeNull();

    // Page by page in threes: the same jobs in the same order, none twice.
    const paged: number[] = [];
    for (let page = 1; (page - 1) * 3 < all.total; page++) {
      paged.push(
        ...((await tech.get('/api/jobs').query({ pageSize: 3, page })).body.items as { id: number }[]).map((j) => j.id),
      );
    }
    expect(paged).toEqual(all.items.map((j) => j.id));

    const week = (
      await tech.get('/api/jobs').query({ from: shopDay(-2), to: shopDay(0), pageSize: 100 })
    ).body.items.map((j: { id: number }) => j.id);
    expect(week).toEqual(expect.arrayContaining([overdue.id, today.id]));
    expect(week).not.toContain(later.id);
    expect(week).not.toContain(waiting.id);
    const wrong = await tech.get('/api/jobs').query({ from: shopDay(2), to: shopDay(0) });
    expect(wrong.status).toBe(422);
    expect(wrong.body.errors).toEqual([expect.objectContaining({ field: 'to' })]);
  }, 120_000);
});
