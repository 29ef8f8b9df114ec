import 'server-only';
import { literal, Op, type WhereOptions } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { hashToken } from '@/lib/auth/tokens';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import type { Shortlist } from '@/lib/leads/shortlist';
import type { LeadAnswers, LeadStatus } from '@/lib/schemas/lead';
import type { LeadRecord } from '@/lib/leads/types';
import { Cam, db, Lead } from '../models';
import { getShopSettings } from './settings';

// Leads from the at-home questionnaire: stored answers, the shortlist the customer saw, a status the
// shop moves along, and only the SHA-256 of the customer's private result link.

function toRecord(lead: Lead): LeadRecord {
  return {
    id: lead.id,
    name: lead.name,
    email: lead.email,
    phone: lead.phone,
    answers: lead.answers as Partial<LeadAnswers>,
    shortlist: (lead.shortlist as Shortlist | null) ?? null,
    status: lead.status,
    version: lead.version,
    createdAt: lead.createdAt.toISOString(),
    updatedAt: lead.updatedAt.toISOString(),
  };
}

/** Leads from this e-mail or phone since `since`: the flood guard on POST /api/leads. */
export async function countRecentLeads(contact: { email?: string; phone?: string }, since: Date): Promise<number> {
  const who: WhereOptions[] = [];
  if (contact.email) who.push({ email: contact.email });
  if (contact.phone) who.push({ phone: contact.phone });
  if (!who.length) return 0;
  return Lead.count({ where: { createdAt: { [Op.gte]: since }, [Op.or]: who } });
}

/** Which of these cams are certified for road use where emissions are tested. */
export async function emissionsCertifiedIds(camIds: (string | number)[]): Promise<Set<string>> {
  const ids = camIds.map(Number).filter(Number.isSafeInteger);
  if (!ids.length) return new Set();
  const cams = await Cam.findAll({ where: { id: { [Op.in]: ids }, emissionsCertified: true }, attributes: ['id'] });
  return new Set(cams.map((c) => String(c.id)));
}

/** Stores the lead, its answers and shortlist, and the token's hash, in one transaction with its audit row. */
export async function createLead(
  answers: LeadAnswers,
  shortlist: Shortlist,
  token: string,
  ip: string | null,
): Promise<LeadRecord> {
  const lead = await db().transaction(async (t) => {
    const row = await Lead.create(
      {
        name: answers.name,
        email: answers.email ?? null,
        phone: answers.phone ?? null,
        answers,
        shortlist,
        publicTokenHash: hashToken(token),
        customerId: null,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actor: answers.email ?? answers.phone ?? 'questionnaire',
        action: 'lead.created',
        entityType: 'lead',
        entityId: row.id,
        ip,
      },
      t,
    );
    return row;
  });
  return toRecord(lead);
}

/** The customer's own result by private link; null for anything that is not a live link. */
export async function getLeadByToken(
  token: string,
): Promise<{ lead: LeadRecord; shop: { name: string; phone: string; email: string } | null } | null> {
  if (!/^[A-Za-z0-9_-]{20,128}$/.test(token)) return null;
  const row = await Lead.findOne({ where: { publicTokenHash: hashToken(token) } });
  if (!row) return null;
  const settings = await getShopSettings();
  return {
    lead: toRecord(row),
    shop: settings ? { name: settings.name, phone: settings.phone, email: settings.email } : null,
  };
}

export async function getLead(id: number): Promise<LeadRecord | null> {
  const row = await Lead.findByPk(id);
  return row ? toRecord(row) : null;
}

export async function listLeads({
  status,
  page,
  pageSize,
}: {
  status?: LeadStatus;
  page: number;
  pageSize: number;
}): Promise<{ items: LeadRecord[]; total: number }> {
  const { rows, count } = await Lead.findAndCountAll({
    where: status ? { status } : {},
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  return { items: rows.map(toRecord), total: count };
}

/**
 * New leads nobody has touched since `cutoff`: arrived before it, still "new", no note written since.
 * The same rule as staleDays() in src/lib/leads/stale.ts, counted over every page of the list.
 */
export async function countStaleLeads(cutoff: Date): Promise<number> {
  return Lead.count({
    where: {
      status: 'new',
      createdAt: { [Op.lt]: cutoff },
      // A subquery of its own, not one that names the outer table: the model's alias is minified in the build.
      id: { [Op.notIn]: literal(`(SELECT n.lead_id FROM lead_notes n WHERE n.created_at >= ${db().escape(cutoff)})`) },
    },
  });
}

/** Moves a lead to another status; a stale version is a conflict (409) with the current lead. */
export async function updateLeadStatus(
  id: number,
  values: { version: number; status: LeadStatus },
  user: SessionUser,
): Promise<WriteOutcome<LeadRecord>> {
  return runWrite(
    async (t) => {
      const lead = await Lead.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!lead) throw notFound();
      if (lead.version !== values.version) throw conflict(toRecord(lead));
      if (lead.status === values.status) return { record: toRecord(lead), changed: false };
      const before = { status: lead.status };
      lead.set({ status: values.status });
      await lead.save({ transaction: t });
      await recordAudit(
        {
          user,
          action: 'lead.status-changed',
          entityType: 'lead',
          entityId: id,
          before,
          after: { status: values.status },
        },
        t,
      );
      return { record: toRecord(lead) };
    },
    { reload: () => getLead(id) },
  );
}
