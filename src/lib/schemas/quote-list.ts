import { z } from 'zod';
import { QUOTE_STATUSES } from '@/lib/db/models/quote';
import { pageParams } from './catalogue-cam';
import { text } from './text';

// Query string of GET /api/quotes and the /quotes page: a state, a search, a page. Server-only (it
// reads the state list from the model).
export const QUOTE_LIST_LIMITS = { defaultPageSize: 50, maxPageSize: 200 } as const;

const L = QUOTE_LIST_LIMITS;

export const QuoteListQuerySchema = z.strictObject({
  status: z.enum(QUOTE_STATUSES, { error: `status must be one of: ${QUOTE_STATUSES.join(', ')}` }).optional(),
  /** Quote number (from its start), customer name, e-mail or phone, vehicle (word starts). */
  q: pageParams.q,
  page: pageParams.page,
  pageSize: text('pageSize')
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === '') return L.defaultPageSize;
      const n = Number(v);
      if (!/^\d+$/.test(v.trim()) || !Number.isSafeInteger(n) || n < 1 || n > L.maxPageSize) {
        ctx.addIssue({ code: 'custom', message: `pageSize must be a whole number from 1 to ${L.maxPageSize}` });
        return z.NEVER;
      }
      return n;
    }),
});

export type QuoteListQuery = z.output<typeof QuoteListQuerySchema>;
