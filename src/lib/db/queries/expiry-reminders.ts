import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { Quote } from '../models';

// The rows the expiry reminder (src/lib/quotes/expiry-reminders.ts) reads and stamps. SQL only.

type ReminderFields = Pick<Quote, 'status' | 'validUntil' | 'expiryRemindedAt'>;

/** Still due a reminder: sent or accepted, never reminded, valid through today … `through` (UTC days). */
export const dueForReminder = (q: ReminderFields, today: string, through: string) =>
  (q.status === 'sent' || q.status === 'accepted') &&
  q.expiryRemindedAt === null &&
  q.validUntil !== null &&
  q.validUntil >= today &&
  q.validUntil <= through;

/** The candidates, soonest valid-until first (tie-break on id); each is locked and checked again before mailing. */
export function reminderCandidates(today: string, through: string): Promise<Pick<Quote, 'id' | 'number'>[]> {
  return Quote.findAll({
    where: {
      status: { [Op.in]: ['sent', 'accepted'] },
      expiryRemindedAt: null,
      validUntil: { [Op.between]: [today, through] },
    },
    attributes: ['id', 'number'],
    order: [
      ['validUntil', 'ASC'],
      ['id', 'ASC'],
    ],
  });
}

/** A plain UPDATE: the reminder must not move the quote's version under a colleague's open page. */
export async function stampReminded(id: number, at: Date, t: Transaction): Promise<void> {
  await Quote.update({ expiryRemindedAt: at }, { where: { id }, transaction: t, silent: true });
}
