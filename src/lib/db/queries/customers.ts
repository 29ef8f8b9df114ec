import 'server-only';
import { literal, Op, type Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import type { CustomerListQuery, CustomerValues } from '@/lib/schemas/customer';
import { Build, Customer, db } from '../models';
import { textSearch, type TextSearch } from './text-search';

// Customers: search, read, create, change. Route handlers and pages call these; nothing else
// builds queries on the customers table.

export type CustomerRecord = {
  id: number;
  name: string;
  email: string | null;
  phone: string | null;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
};

export type CustomerDetail = CustomerRecord & { builds: { id: number; vehicleLabel: string; updatedAt: string }[] };

export function toCustomerRecord(c: Customer): CustomerRecord {
  return {
    id: c.id,
    name: c.name,
    email: c.email ?? null,
    phone: c.phone ?? null,
    notes: c.notes ?? null,
    version: c.version,
    createdAt: new Date(c.createdAt).toISOString(),
    updatedAt: new Date(c.updatedAt).toISOString(),
  };
}

/** The fields a PATCH merges its changes over. */
export function customerFormValues(r: CustomerRecord): CustomerValues {
  return { name: r.name, email: r.email, phone: r.phone, notes: r.notes };
}

/**
 * The SQL condition "this customer matches the search", on the customers table under `alias`. Served by
 * the customers_search FULLTEXT index; words too short for it are a prefix of the name alone, read in
 * name order straight off customers_name_id (a short prefix of an e-mail or phone finds nobody useful).
 * Values are escaped by the driver; quotes and builds search their customers through this too.
 */
export function customerMatchSql(search: Exclude<TextSearch, { kind: 'nothing' }>, alias?: string): string {
  const e = (v: string) => db().escape(v);
  // Unqualified for a query on customers alone: the production build minifies model names, and with
  // them the table alias Sequelize writes.
  const c = (column: string) => (alias ? `${alias}.${column}` : column);
  if (search.kind === 'fulltext')
    return `MATCH(${c('name')}, ${c('email')}, ${c('phone')}) AGAINST (${e(search.against)} IN BOOLEAN MODE)`;
  return `${c('name')} LIKE ${e(search.like)}`;
}

/** Customers with a word of name, e-mail or phone starting with each word of q (short words: the name's start), by name. */
export async function listCustomers(query: CustomerListQuery): Promise<{ items: CustomerRecord[]; total: number }> {
  const search = query.q ? textSearch(query.q) : null;
  if (search?.kind === 'nothing') return { items: [], total: 0 };
  const { rows, count } = await Customer.findAndCountAll({
    where: search ? { [Op.and]: [literal(customerMatchSql(search))] } : {},
    order: [
      ['name', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(toCustomerRecord), total: count };
}

export async function getCustomer(id: number, transaction?: Transaction): Promise<CustomerRecord | null> {
  const c = await Customer.findByPk(id, { transaction });
  return c ? toCustomerRecord(c) : null;
}

export async function getCustomerDetail(id: number): Promise<CustomerDetail | null> {
  const c = await Customer.findByPk(id);
  if (!c) return null;
  const builds = await Build.findAll({
    where: { customerId: id },
    attributes: ['id', 'vehicleLabel', 'updatedAt'],
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  return {
    ...toCustomerRecord(c),
    builds: builds.map((b) => ({
      id: b.id,
      vehicleLabel: b.vehicleLabel,
      updatedAt: new Date(b.updatedAt).toISOString(),
    })),
  };
}

/** Inside a caller's transaction (a build created with a new customer inline uses this too). */
export async function insertCustomer(
  values: CustomerValues,
  user: SessionUser,
  t: Transaction,
): Promise<CustomerRecord> {
  const c = await Customer.create({ ...values }, { transaction: t });
  const record = toCustomerRecord(c);
  await recordAudit(
    { user, action: 'customer.created', entityType: 'customer', entityId: c.id, before: null, after: record },
    t,
  );
  return record;
}

export async function createCustomer(values: CustomerValues, user: SessionUser): Promise<WriteOutcome<CustomerRecord>> {
  return runWrite(async (t) => ({ record: await insertCustomer(values, user, t) }));
}

/** Applies validated values when the client's version is still current; otherwise 409 with the current record. */
export async function updateCustomer(
  id: number,
  expectedVersion: number,
  values: CustomerValues,
  user: SessionUser,
): Promise<WriteOutcome<CustomerRecord>> {
  return runWrite(
    async (t) => {
      const c = await Customer.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!c) throw notFound();
      const before = toCustomerRecord(c);
      if (c.version !== expectedVersion) throw conflict(before);
      c.set(values);
      if (!c.changed()) return { record: before, changed: false };
      await c.save({ transaction: t });
      const after = toCustomerRecord(c);
      await recordAudit({ user, action: 'customer.updated', entityType: 'customer', entityId: id, before, after }, t);
      return { record: after };
    },
    { reload: () => getCustomer(id) },
  );
}
