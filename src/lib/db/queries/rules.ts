import 'server-only';
import type { Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import type { NeedRuleInput } from '@/lib/catalogue/need-rules';
import { conflict, invalid, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import type { FieldError } from '@/lib/http/responses';
import type { NeedRuleValues } from '@/lib/schemas/need-rule';
import { LaborOperation, NeedRule, NeedRuleItem, Part } from '../models';

// The manager's need rules with their items. loadNeedRules() is what the advisor and the quote
// builder call before evaluateNeedRules() from '@/lib/catalogue/need-rules'.

export type NeedRuleRecord = NeedRuleInput & { version: number; updatedAt: string };

type RuleRow = NeedRule & { items?: (NeedRuleItem & { part?: Part | null; laborOperation?: LaborOperation | null })[] };

const include = () => [
  {
    model: NeedRuleItem,
    as: 'items',
    include: [
      { model: Part, as: 'part', attributes: ['id', 'sku', 'name', 'priceCents', 'category'] },
      { model: LaborOperation, as: 'laborOperation', attributes: ['id', 'code', 'name', 'hours'] },
    ],
  },
];

export function toRuleRecord(rule: RuleRow): NeedRuleRecord {
  return {
    id: rule.id,
    kind: rule.kind,
    vehicleClass: rule.vehicleClass ?? null,
    label: rule.label,
    active: Boolean(rule.active),
    version: rule.version,
    updatedAt: new Date(rule.updatedAt).toISOString(),
    items: [...(rule.items ?? [])]
      .sort((a, b) => a.id - b.id)
      .map((item) => ({
        partId: item.partId ?? null,
        laborOperationId: item.laborOperationId ?? null,
        quantity: Number(item.quantity),
        part: item.part
          ? {
              id: item.part.id,
              sku: item.part.sku,
              name: item.part.name,
              priceCents: item.part.priceCents,
              category: item.part.category,
            }
          : null,
        laborOperation: item.laborOperation
          ? {
              id: item.laborOperation.id,
              code: item.laborOperation.code,
              name: item.laborOperation.name,
              hours: Number(item.laborOperation.hours),
            }
          : null,
      })),
  };
}

export async function listRules(): Promise<NeedRuleRecord[]> {
  const rows = await NeedRule.findAll({ include: include(), order: [['id', 'ASC']] });
  return rows.map(toRuleRecord);
}

/** The active rules, in order, with each item's part and labour details, ready for evaluateNeedRules(). */
export async function loadNeedRules(): Promise<NeedRuleInput[]> {
  return (await listRules()).filter((r) => r.active);
}

/** The stored rule as the form's values: what a PATCH body is laid over before the whole rule is checked again. */
export function ruleFormValues(rule: NeedRuleRecord): Omit<Record<keyof NeedRuleValues, unknown>, 'threshold'> {
  return {
    kind: rule.kind,
    vehicleClass: rule.vehicleClass,
    label: rule.label,
    active: rule.active,
    items: rule.items.map((i) => ({ partId: i.partId, laborOperationId: i.laborOperationId, quantity: i.quantity })),
  };
}

export async function getRule(id: number, transaction?: Transaction): Promise<NeedRuleRecord | null> {
  const rule = await NeedRule.findByPk(id, { include: include(), transaction });
  return rule ? toRuleRecord(rule) : null;
}

async function checkItems(values: NeedRuleValues, t: Transaction) {
  const errors: FieldError[] = [];
  for (const [index, item] of values.items.entries()) {
    if (item.partId !== null && !(await Part.findByPk(item.partId, { transaction: t })))
      errors.push({ field: `items.${index}.partId`, message: `there is no part with id ${item.partId}` });
    if (item.laborOperationId !== null && !(await LaborOperation.findByPk(item.laborOperationId, { transaction: t }))) {
      errors.push({
        field: `items.${index}.laborOperationId`,
        message: `there is no labour operation with id ${item.laborOperationId}`,
      });
    }
  }
  if (errors.length) throw invalid(errors);
}

async function writeItems(ruleId: number, values: NeedRuleValues, t: Transaction) {
  await NeedRuleItem.destroy({ where: { ruleId }, transaction: t });
  await NeedRuleItem.bulkCreate(
    values.items.map((item) => ({
      ruleId,
      partId: item.partId,
      laborOperationId: item.laborOperationId,
      quantity: item.quantity.toFixed(2),
    })),
    { transaction: t },
  );
}

export async function createRule(values: NeedRuleValues, user: SessionUser): Promise<WriteOutcome<NeedRuleRecord>> {
  return runWrite(async (t) => {
    await checkItems(values, t);
    const rule = await NeedRule.create(
      { kind: values.kind, vehicleClass: values.vehicleClass, label: values.label, active: values.active },
      { transaction: t },
    );
    await writeItems(rule.id, values, t);
    const record = (await getRule(rule.id, t))!;
    await recordAudit(
      { user, action: 'rule.created', entityType: 'need_rule', entityId: String(rule.id), before: null, after: record },
      t,
    );
    return { record };
  });
}

const itemsKey = (r: Pick<NeedRuleRecord, 'items'>) =>
  JSON.stringify(r.items.map((i) => [i.partId, i.laborOperationId, i.quantity]));

export async function updateRule(
  id: number,
  expectedVersion: number,
  values: NeedRuleValues,
  user: SessionUser,
): Promise<WriteOutcome<NeedRuleRecord>> {
  return runWrite(
    async (t) => {
      const rule = await NeedRule.findByPk(id, { include: include(), transaction: t, lock: t.LOCK.UPDATE });
      if (!rule) throw notFound();
      const before = toRuleRecord(rule);
      if (rule.version !== expectedVersion) throw conflict(before);
      await checkItems(values, t);
      const itemsChanged =
        itemsKey(before) !==
        itemsKey({ items: values.items.map((i) => ({ ...i, quantity: Number(i.quantity.toFixed(2)) })) });
      rule.set({ kind: values.kind, vehicleClass: values.vehicleClass, label: values.label, active: values.active });
      if (!rule.changed() && !itemsChanged) return { record: before, changed: false };
      if (itemsChanged) {
        await writeItems(id, values, t);
        // Items live in their own table; the rule's version still moves so other editors see the change.
        rule.changed('updatedAt', true);
      }
      await rule.save({ transaction: t });
      const after = (await getRule(id, t))!;
      await recordAudit(
        { user, action: 'rule.updated', entityType: 'need_rule', entityId: String(id), before, after },
        t,
      );
      return { record: after };
    },
    { reload: () => getRule(id) },
  );
}

export async function removeRule(id: number, user: SessionUser): Promise<WriteOutcome<NeedRuleRecord>> {
  return runWrite(async (t) => {
    const rule = await NeedRule.findByPk(id, { include: include(), transaction: t, lock: t.LOCK.UPDATE });
    if (!rule) throw notFound();
    const before = toRuleRecord(rule);
    await NeedRuleItem.destroy({ where: { ruleId: id }, transaction: t });
    await rule.destroy({ transaction: t });
    await recordAudit(
      { user, action: 'rule.deleted', entityType: 'need_rule', entityId: String(id), before, after: null },
      t,
    );
    return { record: before };
  });
}
