import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, invalid, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import { BUILD_RECORD_LIMITS, type BuildCreate, type BuildListQuery, type BuildUpdate } from '@/lib/schemas/build';
import type { BaselineCardOption } from '@/lib/builds/types';
import { Build, Cam, Customer, db } from '../models';
import { refreshDynoGains } from './dyno-gains';
import { linkLeadToCustomer } from './lead-links';
import { customerMatchSql, insertCustomer } from './customers';
import { textSearch } from './text-search';

export type BuildSummary = { id: number; vehicleLabel: string; customerName: string; profile: unknown };

/** Saved builds, newest first, with whose they are: the advisor page starts from one of these. */
export async function listBuildSummaries(limit = 50): Promise<BuildSummary[]> {
  const builds = await Build.findAll({
    include: [{ model: Customer, as: 'customer', attributes: ['name'] }],
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit,
  });
  return builds.map(toSummary);
}

/** One build as a summary (the advisor page asks for it when a link names a build beyond the newest). */
export async function getBuildSummary(id: number): Promise<BuildSummary | null> {
  const build = await Build.findByPk(id, { include: [{ model: Customer, as: 'customer', attributes: ['name'] }] });
  return build ? toSummary(build) : null;
}

type BuildWithCustomer = Build & { customer?: Customer | null };

function toSummary(build: Build): BuildSummary {
  const customer = (build as BuildWithCustomer).customer;
  return {
    id: build.id,
    vehicleLabel: build.vehicleLabel,
    customerName: customer?.name ?? 'Unknown customer',
    profile: build.profile,
  };
}

export type BuildRecord = {
  id: number;
  customerId: number;
  customerName: string;
  vehicleLabel: string;
  baselineCamId: number | null;
  profile: Record<string, unknown>;
  profileSchemaVersion: number;
  version: number;
  createdAt: string;
  updatedAt: string;
};

/** A row of the recent-builds list: no profile, a few figures a person recognises the build by. */
export type BuildListItem = Omit<BuildRecord, 'profile'> & {
  customerPhone: string | null;
  customerEmail: string | null;
  primaryUse: string | null;
  emissionsRequired: boolean | null;
};

function toBuildRecord(build: Build): BuildRecord {
  const customer = (build as BuildWithCustomer).customer;
  return {
    id: build.id,
    customerId: build.customerId,
    customerName: customer?.name ?? 'Unknown customer',
    vehicleLabel: build.vehicleLabel,
    baselineCamId: build.baselineCamId ?? null,
    profile: build.profile,
    profileSchemaVersion: build.profileSchemaVersion,
    version: build.version,
    createdAt: new Date(build.createdAt).toISOString(),
    updatedAt: new Date(build.updatedAt).toISOString(),
  };
}

function toListItem(build: Build): BuildListItem {
  const { profile, ...rest } = toBuildRecord(build);
  const customer = (build as BuildWithCustomer).customer;
  const use = (profile as { use?: { primary?: unknown; emissionsRequired?: unknown } }).use;
  return {
    ...rest,
    customerPhone: customer?.phone ?? null,
    customerEmail: customer?.email ?? null,
    primaryUse: typeof use?.primary === 'string' ? use.primary : null,
    emissionsRequired: typeof use?.emissionsRequired === 'boolean' ? use.emissionsRequired : null,
  };
}

const withCustomer = () => [{ model: Customer, as: 'customer', attributes: ['id', 'name', 'email', 'phone'] }];

/**
 * The ids of builds whose vehicle or customer matches q, as a UNION of indexed lookups (the builds and
 * customers FULLTEXT indexes; short words: a prefix of the customer's name, e-mail or phone). One OR
 * across the join could only be answered by reading every build. Null when q holds nothing searchable.
 */
function matchingIdsSql(q: string): string | null {
  const search = textSearch(q);
  if (search.kind === 'nothing') return null;
  const parts = [
    `SELECT bc.id FROM customers c JOIN builds bc ON bc.customer_id = c.id WHERE ${customerMatchSql(search, 'c')}`,
  ];
  if (search.kind === 'fulltext')
    parts.push(
      `SELECT id FROM builds WHERE MATCH(vehicle_label) AGAINST (${db().escape(search.against)} IN BOOLEAN MODE)`,
    );
  return parts.join(' UNION ');
}

/** Newest change first (id breaks ties), a page at a time; q matches the vehicle or the customer. */
export async function listBuilds(query: BuildListQuery): Promise<{ items: BuildListItem[]; total: number }> {
  const sequelize = db();
  const matching = query.q ? matchingIdsSql(query.q) : undefined;
  if (matching === null) return { items: [], total: 0 };
  const from = matching ? `(${matching}) m JOIN builds b ON b.id = m.id` : 'builds b';
  const where = query.customerId !== undefined ? `WHERE b.customer_id = ${sequelize.escape(query.customerId)}` : '';
  const offset = (query.page - 1) * query.pageSize;
  const [ids, counted] = await Promise.all([
    sequelize.query<{ id: number }>(
      `SELECT b.id FROM ${from} ${where} ORDER BY b.updated_at DESC, b.id DESC LIMIT ${query.pageSize} OFFSET ${offset}`,
      { type: QueryTypes.SELECT },
    ),
    sequelize.query<{ total: unknown }>(`SELECT COUNT(*) AS total FROM ${from} ${where}`, { type: QueryTypes.SELECT }),
  ]);
  const total = Number(counted[0]?.total ?? 0);
  if (!ids.length) return { items: [], total };
  const rows = await Build.findAll({ where: { id: ids.map((r) => Number(r.id)) }, include: withCustomer() });
  const byId = new Map(rows.map((r) => [r.id, r]));
  return { items: ids.flatMap((r) => (byId.has(Number(r.id)) ? [toListItem(byId.get(Number(r.id))!)] : [])), total };
}

export async function getBuild(id: number, transaction?: Transaction): Promise<BuildRecord | null> {
  const build = await Build.findByPk(id, { include: withCustomer(), transaction });
  return build ? toBuildRecord(build) : null;
}

/** The fields a PATCH merges its changes over. */
export function buildFormValues(r: BuildRecord): Record<keyof BuildUpdate, unknown> {
  return { customerId: r.customerId, vehicleLabel: r.vehicleLabel, baselineCamId: r.baselineCamId, profile: r.profile };
}

async function checkCustomer(customerId: number, t: Transaction) {
  if (!(await Customer.findByPk(customerId, { transaction: t })))
    throw invalid([{ field: 'customerId', message: `there is no customer with id ${customerId}` }]);
}

async function checkBaselineCam(camId: number | null, t: Transaction) {
  if (camId === null) return;
  if (!(await Cam.findByPk(camId, { attributes: ['id'], transaction: t })))
    throw invalid([{ field: 'baselineCamId', message: `there is no cam with id ${camId} in the catalogue` }]);
}

/** A new build, with a new customer when one is given inline; all in one transaction. */
export async function createBuild(values: BuildCreate, user: SessionUser): Promise<WriteOutcome<BuildRecord>> {
  return runWrite(async (t) => {
    let customerId: number;
    if (values.customer) customerId = (await insertCustomer(values.customer, user, t)).id;
    else {
      customerId = values.customerId!;
      await checkCustomer(customerId, t);
    }
    await checkBaselineCam(values.baselineCamId, t);
    const build = await Build.create(
      {
        customerId,
        vehicleLabel: values.vehicleLabel,
        baselineCamId: values.baselineCamId,
        profile: values.profile,
        profileSchemaVersion: BUILD_RECORD_LIMITS.profileSchemaVersion,
      },
      { transaction: t },
    );
    if (values.leadId !== undefined) await linkLeadToCustomer(values.leadId, customerId, user, t);
    const record = (await getBuild(build.id, t))!;
    await recordAudit(
      { user, action: 'build.created', entityType: 'build', entityId: build.id, before: null, after: record },
      t,
    );
    return { record };
  });
}

/** Applies validated values when the client's version is still current; otherwise 409 with the current record. */
export async function updateBuild(
  id: number,
  expectedVersion: number,
  values: BuildUpdate,
  user: SessionUser,
): Promise<WriteOutcome<BuildRecord>> {
  return runWrite(
    async (t) => {
      const build = await Build.findByPk(id, { include: withCustomer(), transaction: t, lock: t.LOCK.UPDATE });
      if (!build) throw notFound();
      const before = toBuildRecord(build);
      if (build.version !== expectedVersion) throw conflict(before);
      if (values.customerId !== before.customerId) await checkCustomer(values.customerId, t);
      if (values.baselineCamId !== before.baselineCamId) await checkBaselineCam(values.baselineCamId, t);
      const sameProfile = JSON.stringify(values.profile) === JSON.stringify(before.profile);
      build.set({
        customerId: values.customerId,
        vehicleLabel: values.vehicleLabel,
        baselineCamId: values.baselineCamId,
      });
      // JSON columns compare by reference; only mark the profile when its content differs.
      if (!sameProfile)
        build.set({ profile: values.profile, profileSchemaVersion: BUILD_RECORD_LIMITS.profileSchemaVersion });
      if (!build.changed()) return { record: before, changed: false };
      await build.save({ transaction: t });
      // The measured history is filed under the engine's figures: a new profile refiles it.
      if (!sameProfile) await refreshDynoGains([id], t);
      const after = (await getBuild(id, t))!;
      await recordAudit({ user, action: 'build.updated', entityType: 'build', entityId: id, before, after }, t);
      return { record: after };
    },
    { reload: () => getBuild(id) },
  );
}

/** The catalogue's factory-baseline cards (not archived), for "the cam in the engine now". */
export async function listBaselineCards(): Promise<BaselineCardOption[]> {
  const cams = await Cam.findAll({
    where: { isFactoryBaseline: true, archivedAt: null },
    order: [
      ['baselineForLiters', 'ASC'],
      ['sku', 'ASC'],
    ],
  });
  const n = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  return cams.map((c) => ({
    id: c.id,
    sku: c.sku,
    name: c.name,
    baselineForLiters: n(c.baselineForLiters),
    intakeDuration050: Number(c.intakeDuration050),
    exhaustDuration050: Number(c.exhaustDuration050),
    intakeAdvertised: n(c.intakeAdvertised),
    exhaustAdvertised: n(c.exhaustAdvertised),
    intakeLiftIn: Number(c.intakeLiftIn),
    exhaustLiftIn: Number(c.exhaustLiftIn),
    lsa: Number(c.lsa),
    intakeCenterline: Number(c.intakeCenterline),
    rockerRatio: Number(c.rockerRatio),
    springMaxLiftIn: n(c.springMaxLiftIn),
  }));
}
