import 'server-only';
import { Op, type Order, type Transaction, type WhereOptions } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import {
  changedFields,
  conflict,
  countReferences,
  invalid,
  likeTerm,
  notFound,
  runWrite,
  type WriteOutcome,
} from '@/lib/db/write';
import { CATALOGUE_CAM_FIELDS, type CamListQuery, type CatalogueCam } from '@/lib/schemas/catalogue-cam';
import type { CamRecord, SupplierOption } from '@/lib/catalogue/types';
import { Cam, Supplier } from '../models';

// The shop's cams: list, read, create, change, archive, import and export. Route handlers and pages
// call these; nothing else builds queries on the cams table.

type CamWithSupplier = Cam & { supplier?: Supplier | null };

export function toCamRecord(cam: CamWithSupplier): CamRecord {
  return {
    id: cam.id,
    sku: cam.sku,
    name: cam.name,
    supplierId: cam.supplierId ?? null,
    supplierName: cam.supplier?.name ?? null,
    intakeDuration050: cam.intakeDuration050,
    exhaustDuration050: cam.exhaustDuration050,
    intakeAdvertised: cam.intakeAdvertised ?? null,
    exhaustAdvertised: cam.exhaustAdvertised ?? null,
    intakeLiftIn: cam.intakeLiftIn,
    exhaustLiftIn: cam.exhaustLiftIn,
    lsa: cam.lsa,
    intakeCenterline: cam.intakeCenterline,
    rockerRatio: cam.rockerRatio,
    springMaxLiftIn: cam.springMaxLiftIn ?? null,
    deactivationCompatible: Boolean(cam.deactivationCompatible),
    emissionsCertified: Boolean(cam.emissionsCertified),
    isFactoryBaseline: Boolean(cam.isFactoryBaseline),
    baselineForLiters:
      cam.baselineForLiters === null || cam.baselineForLiters === undefined ? null : Number(cam.baselineForLiters),
    priceCents: cam.priceCents,
    costCents: cam.costCents,
    stockOnHand: cam.stockOnHand,
    active: Boolean(cam.active),
    archivedAt: cam.archivedAt ? new Date(cam.archivedAt).toISOString() : null,
    notes: cam.notes ?? null,
    version: cam.version,
    createdAt: new Date(cam.createdAt).toISOString(),
    updatedAt: new Date(cam.updatedAt).toISOString(),
  };
}

/** The fields a form edits, from a stored record (the PATCH merges the client's changes over these). */
export function camFormValues(record: CamRecord): Record<keyof CatalogueCam, unknown> {
  const out = {} as Record<keyof CatalogueCam, unknown>;
  for (const field of CATALOGUE_CAM_FIELDS) out[field] = record[field];
  return out;
}

/** What the database stores for validated values (undefined → NULL). */
function camColumns(values: CatalogueCam) {
  return {
    sku: values.sku,
    name: values.name,
    supplierId: values.supplierId,
    intakeDuration050: values.intakeDuration050,
    exhaustDuration050: values.exhaustDuration050,
    intakeAdvertised: values.intakeAdvertised ?? null,
    exhaustAdvertised: values.exhaustAdvertised ?? null,
    intakeLiftIn: values.intakeLiftIn,
    exhaustLiftIn: values.exhaustLiftIn,
    lsa: values.lsa,
    intakeCenterline: values.intakeCenterline,
    rockerRatio: values.rockerRatio,
    springMaxLiftIn: values.springMaxLiftIn ?? null,
    deactivationCompatible: values.deactivationCompatible,
    emissionsCertified: values.emissionsCertified,
    isFactoryBaseline: values.isFactoryBaseline,
    baselineForLiters: values.baselineForLiters === null ? null : values.baselineForLiters.toFixed(1),
    priceCents: values.priceCents,
    costCents: values.costCents,
    stockOnHand: values.stockOnHand,
    active: values.active,
    notes: values.notes,
  };
}

const withSupplier = () => [{ model: Supplier, as: 'supplier', attributes: ['id', 'name'] }];

function camOrder(query: Pick<CamListQuery, 'sort' | 'dir'>): Order {
  const dir = query.dir === 'desc' ? 'DESC' : 'ASC';
  if (query.sort === 'supplier')
    return [
      [{ model: Supplier, as: 'supplier' }, 'name', dir],
      ['sku', 'ASC'],
    ];
  return [
    [query.sort, dir],
    ['id', 'ASC'],
  ];
}

export async function listCams(query: CamListQuery): Promise<{ items: CamRecord[]; total: number }> {
  const and: WhereOptions<Cam>[] = [];
  if (query.q)
    and.push({ [Op.or]: [{ sku: { [Op.like]: likeTerm(query.q) } }, { name: { [Op.like]: likeTerm(query.q) } }] });
  if (query.supplier !== undefined) and.push({ supplierId: query.supplier });
  if (query.durationMin !== undefined) and.push({ intakeDuration050: { [Op.gte]: query.durationMin } });
  if (query.durationMax !== undefined) and.push({ intakeDuration050: { [Op.lte]: query.durationMax } });
  if (query.lsa !== undefined) and.push({ lsa: query.lsa });
  if (query.lsaMin !== undefined) and.push({ lsa: { [Op.gte]: query.lsaMin } });
  if (query.lsaMax !== undefined) and.push({ lsa: { [Op.lte]: query.lsaMax } });
  if (query.active !== undefined) and.push({ active: query.active });
  if (query.inStock === true) and.push({ stockOnHand: { [Op.gt]: 0 } });
  if (query.inStock === false) and.push({ stockOnHand: { [Op.lte]: 0 } });
  if (query.baseline !== undefined) and.push({ isFactoryBaseline: query.baseline });
  if (query.archived === 'exclude') and.push({ archivedAt: null });
  if (query.archived === 'only') and.push({ archivedAt: { [Op.ne]: null } });
  const { rows, count } = await Cam.findAndCountAll({
    where: { [Op.and]: and },
    include: withSupplier(),
    order: camOrder(query),
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  return { items: rows.map(toCamRecord), total: count };
}

export async function getCam(id: number, transaction?: Transaction): Promise<CamRecord | null> {
  const cam = await Cam.findByPk(id, { include: withSupplier(), transaction });
  return cam ? toCamRecord(cam) : null;
}

export async function listSuppliers(): Promise<SupplierOption[]> {
  const rows = await Supplier.findAll({ attributes: ['id', 'name'], order: [['name', 'ASC']] });
  return rows.map((s) => ({ id: s.id, name: s.name }));
}

async function checkSupplier(supplierId: number | null, transaction: Transaction) {
  if (supplierId === null) return;
  if (!(await Supplier.findByPk(supplierId, { transaction })))
    throw invalid([{ field: 'supplierId', message: `there is no supplier with id ${supplierId}` }]);
}

const uniqueFields = { sku: 'sku' };

export async function createCam(values: CatalogueCam, user: SessionUser): Promise<WriteOutcome<CamRecord>> {
  return runWrite(
    async (t) => {
      await checkSupplier(values.supplierId, t);
      const cam = await Cam.create({ ...camColumns(values), archivedAt: null }, { transaction: t });
      const record = (await getCam(cam.id, t))!;
      await recordAudit(
        { user, action: 'cam.created', entityType: 'cam', entityId: String(cam.id), before: null, after: record },
        t,
      );
      return { record };
    },
    { uniqueFields },
  );
}

/** Applies validated values when the client's version is still current; otherwise 409 with the current record. */
export async function updateCam(
  id: number,
  expectedVersion: number,
  values: CatalogueCam,
  archived: boolean | undefined,
  user: SessionUser,
): Promise<WriteOutcome<CamRecord>> {
  return runWrite(
    async (t) => {
      const cam = await Cam.findByPk(id, { include: withSupplier(), transaction: t, lock: t.LOCK.UPDATE });
      if (!cam) throw notFound();
      const before = toCamRecord(cam);
      if (cam.version !== expectedVersion) throw conflict(before);
      if (values.supplierId !== before.supplierId) await checkSupplier(values.supplierId, t);
      cam.set(camColumns(values));
      if (archived === true && !cam.archivedAt) cam.set({ archivedAt: new Date(), active: false });
      if (archived === false && cam.archivedAt) cam.set({ archivedAt: null });
      if (!cam.changed()) return { record: before, changed: false };
      await cam.save({ transaction: t });
      const after = (await getCam(id, t))!;
      const action =
        archived === true && !before.archivedAt
          ? 'cam.archived'
          : archived === false && before.archivedAt
            ? 'cam.restored'
            : 'cam.updated';
      await recordAudit({ user, action, entityType: 'cam', entityId: String(id), before, after }, t);
      return { record: after };
    },
    { uniqueFields, reload: () => getCam(id) },
  );
}

/** Everything that points at a cam and would lose its meaning if the cam vanished. */
async function camReferenceCount(id: number, transaction: Transaction): Promise<number> {
  const counts = await Promise.all([
    countReferences('quotes', 'cam_id', id, transaction),
    countReferences('quote_lines', 'cam_id', id, transaction),
    countReferences('builds', 'baseline_cam_id', id, transaction),
    countReferences('interviews', 'chosen_cam_id', id, transaction),
    countReferences('dyno_runs', 'cam_id', id, transaction),
  ]);
  return counts.reduce((a, b) => a + b, 0);
}

/**
 * DELETE: a cam that any quote, quote line, build, interview or dyno run refers to is archived
 * (kept, hidden from the advisor and the default list); a cam nothing refers to is deleted.
 */
export async function removeCam(
  id: number,
  user: SessionUser,
): Promise<WriteOutcome<{ outcome: 'archived' | 'deleted'; cam: CamRecord }>> {
  return runWrite<{ outcome: 'archived' | 'deleted'; cam: CamRecord }>(async (t) => {
    const cam = await Cam.findByPk(id, { include: withSupplier(), transaction: t, lock: t.LOCK.UPDATE });
    if (!cam) throw notFound();
    const before = toCamRecord(cam);
    if ((await camReferenceCount(id, t)) > 0) {
      if (!cam.archivedAt) {
        cam.set({ archivedAt: new Date(), active: false });
        await cam.save({ transaction: t });
      }
      const after = (await getCam(id, t))!;
      await recordAudit({ user, action: 'cam.archived', entityType: 'cam', entityId: String(id), before, after }, t);
      return { record: { outcome: 'archived' as const, cam: after } };
    }
    await cam.destroy({ transaction: t });
    await recordAudit({ user, action: 'cam.deleted', entityType: 'cam', entityId: String(id), before, after: null }, t);
    return { record: { outcome: 'deleted' as const, cam: before } };
  });
}

export async function camsBySku(skus: string[]): Promise<Map<string, CamRecord>> {
  const out = new Map<string, CamRecord>();
  for (let i = 0; i < skus.length; i += 1000) {
    const rows = await Cam.findAll({ where: { sku: { [Op.in]: skus.slice(i, i + 1000) } }, include: withSupplier() });
    for (const row of rows) out.set(row.sku.toLowerCase(), toCamRecord(row));
  }
  return out;
}

export async function suppliersByName(): Promise<Map<string, SupplierOption>> {
  const list = await listSuppliers();
  return new Map(list.map((s) => [s.name.trim().toLowerCase(), s]));
}

export type CamImportRow = {
  values: Omit<CatalogueCam, 'supplierId'>;
  supplierName: string | null;
  existing: CamRecord | null;
};

/**
 * Writes a whole import in one transaction: new suppliers by name, then each cam created or updated
 * (by SKU). Any failure rolls everything back. Rows whose existing version moved on since the
 * preview are refused as a conflict, so an import never overwrites a manager's concurrent edit.
 */
export async function commitCamImport(
  rows: CamImportRow[],
  user: SessionUser,
): Promise<WriteOutcome<{ created: number; updated: number; unchanged: number; suppliersAdded: string[] }>> {
  return runWrite(
    async (t) => {
      const suppliers = new Map(
        (await Supplier.findAll({ transaction: t })).map((s) => [s.name.trim().toLowerCase(), s.id]),
      );
      const suppliersAdded: string[] = [];
      let created = 0;
      let updated = 0;
      let unchanged = 0;
      for (const row of rows) {
        let supplierId: number | null = null;
        if (row.supplierName) {
          const key = row.supplierName.trim().toLowerCase();
          if (!suppliers.has(key)) {
            const supplier = await Supplier.create(
              { name: row.supplierName.trim(), contactEmail: null },
              { transaction: t },
            );
            suppliers.set(key, supplier.id);
            suppliersAdded.push(supplier.name);
          }
          supplierId = suppliers.get(key)!;
        }
        const values: CatalogueCam = { ...row.values, supplierId };
        if (!row.existing) {
          const cam = await Cam.create({ ...camColumns(values), archivedAt: null }, { transaction: t });
          const after = (await getCam(cam.id, t))!;
          await recordAudit(
            { user, action: 'cam.imported', entityType: 'cam', entityId: String(cam.id), before: null, after },
            t,
          );
          created += 1;
          continue;
        }
        const cam = await Cam.findByPk(row.existing.id, {
          include: withSupplier(),
          transaction: t,
          lock: t.LOCK.UPDATE,
        });
        if (!cam || cam.version !== row.existing.version) {
          throw invalid([
            {
              field: `sku`,
              message: `${row.values.sku} was changed by someone else since the preview; preview the file again`,
            },
          ]);
        }
        const before = toCamRecord(cam);
        cam.set(camColumns(values));
        if (!cam.changed()) {
          unchanged += 1;
          continue;
        }
        await cam.save({ transaction: t });
        const after = (await getCam(cam.id, t))!;
        await recordAudit(
          { user, action: 'cam.imported', entityType: 'cam', entityId: String(cam.id), before, after },
          t,
        );
        updated += 1;
      }
      return { record: { created, updated, unchanged, suppliersAdded } };
    },
    { uniqueFields },
  );
}

/** Every cam for the CSV export, archived ones too (the file says which). */
export async function allCams(): Promise<CamRecord[]> {
  const rows = await Cam.findAll({ include: withSupplier(), order: [['sku', 'ASC']] });
  return rows.map(toCamRecord);
}

export { changedFields };
