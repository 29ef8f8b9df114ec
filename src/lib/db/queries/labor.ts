import 'server-only';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, countReferences, likeTerm, notFound, refused, runWrite, type WriteOutcome } from '@/lib/db/write';
import { LABOR_FIELDS, type LaborListQuery, type LaborValues } from '@/lib/schemas/labor';
import { LaborOperation } from '../models';

export type LaborRecord = {
  id: number;
  code: string;
  name: string;
  hours: number;
  engines: string;
  active: boolean;
  version: number;
  createdAt: string;
  updatedAt: string;
};

/** DECIMAL(5,2) arrives as a string; hours are read as a number everywhere else. */
export function laborHours(op: Pick<LaborOperation, 'hours'>): number {
  return Number(op.hours);
}

export function toLaborRecord(op: LaborOperation): LaborRecord {
  return {
    id: op.id,
    code: op.code,
    name: op.name,
    hours: laborHours(op),
    engines: op.engines,
    active: Boolean(op.active),
    version: op.version,
    createdAt: new Date(op.createdAt).toISOString(),
    updatedAt: new Date(op.updatedAt).toISOString(),
  };
}

export function laborFormValues(record: LaborRecord): Record<keyof LaborValues, unknown> {
  const out = {} as Record<keyof LaborValues, unknown>;
  for (const field of LABOR_FIELDS) out[field] = record[field];
  return out;
}

export async function listLabor(query: LaborListQuery): Promise<{ items: LaborRecord[]; total: number }> {
  const and: WhereOptions<LaborOperation>[] = [];
  if (query.q)
    and.push({
      [Op.or]: [
        { code: { [Op.like]: likeTerm(query.q) } },
        { name: { [Op.like]: likeTerm(query.q) } },
        { engines: { [Op.like]: likeTerm(query.q) } },
      ],
    });
  if (query.active !== undefined) and.push({ active: query.active });
  const { rows, count } = await LaborOperation.findAndCountAll({
    where: { [Op.and]: and },
    order: [
      [query.sort, query.dir === 'desc' ? 'DESC' : 'ASC'],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(toLaborRecord), total: count };
}

export async function allLabor(): Promise<LaborRecord[]> {
  return (await LaborOperation.findAll({ order: [['code', 'ASC']] })).map(toLaborRecord);
}

export async function getLabor(id: number, transaction?: Transaction): Promise<LaborRecord | null> {
  const op = await LaborOperation.findByPk(id, { transaction });
  return op ? toLaborRecord(op) : null;
}

const columns = (values: LaborValues) => ({ ...values, hours: values.hours.toFixed(2) });

export async function createLabor(values: LaborValues, user: SessionUser): Promise<WriteOutcome<LaborRecord>> {
  return runWrite(
    async (t) => {
      const op = await LaborOperation.create(columns(values), { transaction: t });
      const record = (await getLabor(op.id, t))!;
      await recordAudit(
        { user, action: 'labor.created', entityType: 'labor', entityId: String(op.id), before: null, after: record },
        t,
      );
      return { record };
    },
    { uniqueFields: { code: 'code' } },
  );
}

export async function updateLabor(
  id: number,
  expectedVersion: number,
  values: LaborValues,
  user: SessionUser,
): Promise<WriteOutcome<LaborRecord>> {
  return runWrite(
    async (t) => {
      const op = await LaborOperation.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!op) throw notFound();
      const before = toLaborRecord(op);
      if (op.version !== expectedVersion) throw conflict(before);
      const { hours, ...rest } = columns(values);
      op.set(rest);
      if (Number(hours) !== before.hours) op.set({ hours });
      if (!op.changed()) return { record: before, changed: false };
      await op.save({ transaction: t });
      const after = (await getLabor(id, t))!;
      await recordAudit({ user, action: 'labor.updated', entityType: 'labor', entityId: String(id), before, after }, t);
      return { record: after };
    },
    { uniqueFields: { code: 'code' }, reload: () => getLabor(id) },
  );
}

/** DELETE: refused while a need rule uses it; made inactive when a quote line uses it; else deleted. */
export async function removeLabor(
  id: number,
  user: SessionUser,
): Promise<WriteOutcome<{ outcome: 'deactivated' | 'deleted'; labor: LaborRecord }>> {
  return runWrite<{ outcome: 'deactivated' | 'deleted'; labor: LaborRecord }>(async (t) => {
    const op = await LaborOperation.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!op) throw notFound();
    const before = toLaborRecord(op);
    if ((await countReferences('need_rule_items', 'labor_operation_id', id, t)) > 0) {
      throw refused(`${op.code} is used by a need rule; remove it from the rule first.`);
    }
    if ((await countReferences('quote_lines', 'labor_operation_id', id, t)) > 0) {
      op.set({ active: false });
      await op.save({ transaction: t });
      const after = (await getLabor(id, t))!;
      await recordAudit(
        { user, action: 'labor.deactivated', entityType: 'labor', entityId: String(id), before, after },
        t,
      );
      return { record: { outcome: 'deactivated', labor: after } };
    }
    await op.destroy({ transaction: t });
    await recordAudit(
      { user, action: 'labor.deleted', entityType: 'labor', entityId: String(id), before, after: null },
      t,
    );
    return { record: { outcome: 'deleted', labor: before } };
  });
}
