import 'server-only';
import { Op, type Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { invalid, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import { AIR_NEEDED_BY, correctionFor, type Correction, type CorrectionStandard } from '@/lib/dyno/correction';
import { correctedFigure, peaksOf, pullWithPower, round1 } from '@/lib/dyno/figures';
import type { DynoRunValues } from '@/lib/schemas/dyno-run';
import type { DynoRunView } from '@/lib/dyno/types';
import { Build, Cam, DynoRun, Quote, User } from '../models';
import { refreshDynoGains } from './dyno-gains';

// Dyno runs: written by technicians and managers, read by all staff. Observed figures are stored as
// recorded; corrected figures are worked out on every read from the stored air data, so they always
// follow the formula in src/lib/dyno/correction.ts.

export const JOB_QUOTE_STATUSES = ['deposit-paid', 'accepted'] as const;

type RunWithRefs = DynoRun & { cam?: Cam | null; recordedBy?: User | null };

const includes = () => [
  { model: Cam, as: 'cam', attributes: ['id', 'sku', 'name'] },
  { model: User, as: 'recordedBy', attributes: ['id', 'name'] },
];

export function runCorrection(
  run: Pick<DynoRun, 'correctionStandard' | 'airTempC' | 'baroKpa' | 'humidityPct'>,
): Correction | null {
  // A reading the standard does not use may be missing (DIN 70020 ignores humidity); 0 stands in, unused.
  const standard = run.correctionStandard as CorrectionStandard;
  if (AIR_NEEDED_BY[standard].some((field) => run[field] === null)) return null;
  return correctionFor(standard, {
    airTempC: run.airTempC ?? 0,
    baroKpa: run.baroKpa ?? 0,
    humidityPct: run.humidityPct ?? 0,
  });
}

export function viewOf(run: RunWithRefs): DynoRunView {
  const correction = runCorrection(run);
  const f = correction?.factor;
  const scale = (n: number | null) => (n === null || f === undefined ? null : round1(correctedFigure(n, f)));
  return {
    id: run.id,
    buildId: run.buildId,
    quoteId: run.quoteId ?? null,
    camId: run.camId ?? null,
    camName: run.cam ? `${run.cam.sku} ${run.cam.name}` : null,
    phase: run.phase,
    dynoType: run.dynoType,
    runAt: new Date(run.runAt).toISOString(),
    recordedBy: run.recordedBy?.name ?? null,
    air: { airTempC: run.airTempC, baroKpa: run.baroKpa, humidityPct: run.humidityPct },
    correction,
    observed: {
      peakHp: run.peakHp,
      peakHpRpm: run.peakHpRpm,
      peakTorqueLbFt: run.peakTorqueLbFt,
      peakTorqueRpm: run.peakTorqueRpm,
    },
    corrected: correction ? { peakHp: scale(run.peakHp), peakTorqueLbFt: scale(run.peakTorqueLbFt) } : null,
    curve: run.curve,
    // Torque is scaled by the factor and power computed again from it, so hp = lb·ft · rpm / 5252 still holds.
    correctedCurve:
      run.curve && f !== undefined
        ? pullWithPower(run.curve.map((p) => ({ rpm: p.rpm, torqueLbFt: correctedFigure(p.torqueLbFt, f) })))
        : null,
    notes: run.notes,
  };
}

export async function buildExists(buildId: number): Promise<boolean> {
  return (await Build.count({ where: { id: buildId } })) > 0;
}

export async function listDynoRuns(buildId: number): Promise<DynoRunView[]> {
  const runs = await DynoRun.findAll({
    where: { buildId },
    include: includes(),
    order: [
      ['runAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  return runs.map((r) => viewOf(r as RunWithRefs));
}

export async function getDynoRun(id: number, transaction?: Transaction): Promise<DynoRunView | null> {
  const run = await DynoRun.findByPk(id, { include: includes(), transaction });
  return run ? viewOf(run as RunWithRefs) : null;
}

/** The job a run belongs to: the named quote (it must be this build's), else the build's latest accepted or paid quote. */
async function quoteFor(values: DynoRunValues, t: Transaction): Promise<Quote | null> {
  if (values.quoteId) {
    const quote = await Quote.findByPk(values.quoteId, { transaction: t });
    if (!quote) throw invalid([{ field: 'quoteId', message: `no quote with id ${values.quoteId}` }]);
    if (quote.buildId !== values.buildId)
      throw invalid([{ field: 'quoteId', message: `quote ${values.quoteId} is not for build ${values.buildId}` }]);
    return quote;
  }
  return Quote.findOne({
    where: { buildId: values.buildId, status: { [Op.in]: [...JOB_QUOTE_STATUSES] } },
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'DESC'],
    ],
    transaction: t,
  });
}

export async function createDynoRun(
  values: DynoRunValues,
  user: SessionUser,
  ip: string | null,
): Promise<WriteOutcome<DynoRunView>> {
  return runWrite(async (t) => {
    // Locked first: the build's dyno_gains rows are rewritten below, one write to a build at a time.
    const build = await Build.findByPk(values.buildId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!build) throw invalid([{ field: 'buildId', message: `no build with id ${values.buildId}` }]);
    const quote = await quoteFor(values, t);
    let camId = values.camId ?? null;
    if (camId !== null) {
      if (!(await Cam.count({ where: { id: camId }, transaction: t })))
        throw invalid([{ field: 'camId', message: `no cam with id ${camId}` }]);
    } else {
      camId = values.phase === 'after' ? (quote?.camId ?? null) : (build.baselineCamId ?? null);
    }
    if (values.phase === 'after' && camId === null) {
      throw invalid([
        {
          field: 'camId',
          message:
            'an after run needs the cam that was fitted: give camId (this build has no accepted quote with a cam)',
        },
      ]);
    }
    const curve = values.curve ? pullWithPower(values.curve) : null;
    const peaks = curve
      ? peaksOf(curve)
      : {
          peakHp: values.peak!.hp,
          peakHpRpm: values.peak!.hpRpm,
          peakTorqueLbFt: values.peak!.torqueLbFt,
          peakTorqueRpm: values.peak!.torqueRpm,
        };
    const run = await DynoRun.create(
      {
        buildId: values.buildId,
        quoteId: quote?.id ?? null,
        camId,
        recordedByUserId: user.id,
        phase: values.phase,
        dynoType: values.dynoType,
        runAt: values.runAt ? new Date(values.runAt) : new Date(),
        correctionStandard: values.correctionStandard,
        airTempC: values.airTempC ?? null,
        baroKpa: values.baroKpa ?? null,
        humidityPct: values.humidityPct ?? null,
        ...peaks,
        curve,
        notes: values.notes || null,
      },
      { transaction: t },
    );
    await refreshDynoGains([values.buildId], t);
    const record = (await getDynoRun(run.id, t))!;
    await recordAudit(
      {
        user,
        action: 'dyno-run.recorded',
        entityType: 'dyno-run',
        entityId: run.id,
        after: {
          buildId: record.buildId,
          phase: record.phase,
          dynoType: record.dynoType,
          camId: record.camId,
          observed: record.observed,
          corrected: record.corrected,
        },
        ip,
      },
      t,
    );
    return { record };
  });
}

export async function deleteDynoRun(
  id: number,
  user: SessionUser,
  ip: string | null,
): Promise<WriteOutcome<{ id: number; deleted: true }>> {
  return runWrite(async (t) => {
    // The build before the run, in the order every dyno write takes its locks (no deadlock with a create).
    const owner = await DynoRun.findByPk(id, { attributes: ['id', 'buildId'], transaction: t });
    if (!owner) throw notFound();
    await Build.findByPk(owner.buildId, { attributes: ['id'], transaction: t, lock: t.LOCK.UPDATE });
    const run = await DynoRun.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!run) throw notFound();
    const before = {
      buildId: run.buildId,
      phase: run.phase,
      dynoType: run.dynoType,
      camId: run.camId,
      peakHp: run.peakHp,
      peakTorqueLbFt: run.peakTorqueLbFt,
      runAt: run.runAt,
    };
    await run.destroy({ transaction: t });
    await refreshDynoGains([run.buildId], t);
    await recordAudit({ user, action: 'dyno-run.deleted', entityType: 'dyno-run', entityId: id, before, ip }, t);
    return { record: { id, deleted: true as const } };
  });
}
