import 'server-only';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import {
  conflict,
  countReferences,
  invalid,
  likeTerm,
  notFound,
  refused,
  runWrite,
  type WriteOutcome,
} from '@/lib/db/write';
import { PART_FIELDS, type PartListQuery, type PartValues } from '@/lib/schemas/part';
import { ratedMaxLiftIn, type SpringKit } from '@/lib/catalogue/spring-kits';
import { Part, Supplier } from '../models';

export type PartRecord = {
  id: number;
  sku: string;
  name: string;
  category: PartValues['category'];
  supplierId: number | null;
  supplierName: string | null;
  priceCents: number;
  costCents: number;
  stockOnHand: number;
  spec: Record<string, string | number | boolean> | null;
  active: boolean;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
};

export function toPartRecord(part: Part & { supplier?: Supplier | null }): PartRecord {
  let spec = part.spec as PartRecord['spec'] | string | null;
  if (typeof spec === 'string') {
    try {
      spec = JSON.parse(spec) as PartRecord['spec'];
    } catch {
      spec = null;
    }
  }
  return {
    id: part.id,
    sku: part.sku,
    name: part.name,
    category: part.category,
    supplierId: part.supplierId ?? null,
    supplierName: part.supplier?.name ?? null,
    priceCents: part.priceCents,
    costCents: part.costCents,
    stockOnHand: part.stockOnHand,
    spec: (spec as PartRecord['spec']) ?? null,
    active: Boolean(part.active),
    notes: part.notes ?? null,
    version: part.version,
    createdAt: new Date(part.createdAt).toISOString(),
    updatedAt: new Date(part.updatedAt).toISOString(),
  };
}

export function partFormValues(record: PartRecord): Record<keyof PartValues, unknown> {
  const out = {} as Record<keyof PartValues, unknown>;
  for (const field of PART_FIELDS) out[field] = record[field];
  return out;
}

const withSupplier = () => [{ model: Supplier, as: 'supplier', attributes: ['id', 'name'] }];

export async function listParts(query: PartListQuery): Promise<{ items: PartRecord[]; total: number }> {
  const and: WhereOptions<Part>[] = [];
  if (query.q)
    and.push({ [Op.or]: [{ sku: { [Op.like]: likeTerm(query.q) } }, { name: { [Op.like]: likeTerm(query.q) } }] });
  if (query.category) and.push({ category: query.category });
  if (query.active !== undefined) and.push({ active: query.active });
  if (query.inStock === true) and.push({ stockOnHand: { [Op.gt]: 0 } });
  if (query.inStock === false) and.push({ stockOnHand: { [Op.lte]: 0 } });
  const dir = query.dir === 'desc' ? 'DESC' : 'ASC';
  const { rows, count } = await Part.findAndCountAll({
    where: { [Op.and]: and },
    include: withSupplier(),
    order: [
      [query.sort, dir],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  return { items: rows.map(toPartRecord), total: count };
}

/** Every part, for pickers (rule items) and the CSV export. */
export async function allParts(): Promise<PartRecord[]> {
  return (
    await Part.findAll({
      include: withSupplier(),
      order: [
        ['category', 'ASC'],
        ['sku', 'ASC'],
      ],
    })
  ).map(toPartRecord);
}

export async function getPart(id: number, transaction?: Transaction): Promise<PartRecord | null> {
  const part = await Part.findByPk(id, { include: withSupplier(), transaction });
  return part ? toPartRecord(part) : null;
}

function partColumns(values: PartValues) {
  return { ...values, spec: values.spec };
}

async function checkSupplier(supplierId: number | null, transaction: Transaction) {
  if (supplierId !== null && !(await Supplier.findByPk(supplierId, { transaction }))) {
    throw invalid([{ field: 'supplierId', message: `there is no supplier with id ${supplierId}` }]);
  }
}

export async function createPart(values: PartValues, user: SessionUser): Promise<WriteOutcome<PartRecord>> {
  return runWrite(
    async (t) => {
      await checkSupplier(values.supplierId, t);
      const part = await Part.create(partColumns(values), { transaction: t });
      const record = (await getPart(part.id, t))!;
      await recordAudit(
        { user, action: 'part.created', entityType: 'part', entityId: String(part.id), before: null, after: record },
        t,
      );
      return { record };
    },
    { uniqueFields: { sku: 'sku' } },
  );
}

export async function updatePart(
  id: number,
  expectedVersion: number,
  values: PartValues,
  user: SessionUser,
): Promise<WriteOutcome<PartRecord>> {
  return runWrite(
    async (t) => {
      const part = await Part.findByPk(id, { include: withSupplier(), transaction: t, lock: t.LOCK.UPDATE });
      if (!part) throw notFound();
      const before = toPartRecord(part);
      if (part.version !== expectedVersion) throw conflict(before);
      if (values.supplierId !== before.supplierId) await checkSupplier(values.supplierId, t);
      const { spec, ...rest } = partColumns(values);
      part.set(rest);
      if (JSON.stringify(spec) !== JSON.stringify(before.spec)) part.set({ spec });
      if (!part.changed()) return { record: before, changed: false };
      await part.save({ transaction: t });
      const after = (await getPart(id, t))!;
      await recordAudit({ user, action: 'part.updated', entityType: 'part', entityId: String(id), before, after }, t);
      return { record: after };
    },
    { uniqueFields: { sku: 'sku' }, reload: () => getPart(id) },
  );
}

/**
 * DELETE: a part a need rule uses is refused (take it out of the rule first, so no rule silently loses
 * an item); a part on any quote line is made inactive (kept for the quote's history); otherwise deleted.
 */
export async function removePart(
  id: number,
  user: SessionUser,
): Promise<WriteOutcome<{ outcome: 'deactivated' | 'deleted'; part: PartRecord }>> {
  return runWrite<{ outcome: 'deactivated' | 'deleted'; part: PartRecord }>(async (t) => {
    const part = await Part.findByPk(id, { include: withSupplier(), transaction: t, lock: t.LOCK.UPDATE });
    if (!part) throw notFound();
    const before = toPartRecord(part);
    if ((await countReferences('need_rule_items', 'part_id', id, t)) > 0) {
      throw refused(`${part.sku} is used by a need rule; remove it from the rule first.`);
    }
    if ((await countReferences('quote_lines', 'part_id', id, t)) > 0) {
      part.set({ active: false });
      await part.save({ transaction: t });
      const after = (await getPart(id, t))!;
      await recordAudit(
        { user, action: 'part.deactivated', entityType: 'part', entityId: String(id), before, after },
        t,
      );
      return { record: { outcome: 'deactivated', part: after } };
    }
    await part.destroy({ transaction: t });
    await recordAudit(
      { user, action: 'part.deleted', entityType: 'part', entityId: String(id), before, after: null },
      t,
    );
    return { record: { outcome: 'deleted', part: before } };
  });
}

/** The active spring kits that state a rated max lift (spec `maxLiftIn`), by id: what the springs need picks from. */
export async function loadSpringKits(): Promise<SpringKit[]> {
  const rows = await Part.findAll({
    where: { category: 'springs', active: true },
    attributes: ['id', 'sku', 'name', 'priceCents', 'category', 'spec'],
    order: [['id', 'ASC']],
  });
  return rows.flatMap((p) => {
    const maxLiftIn = ratedMaxLiftIn(p);
    return maxLiftIn === null
      ? []
      : [{ id: p.id, sku: p.sku, name: p.name, priceCents: p.priceCents, category: p.category, maxLiftIn }];
  });
}
