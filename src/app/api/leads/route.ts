import { NextResponse } from 'next/server';
import { clientIp } from '@/lib/auth/request-info';
import { paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { leadListPage } from '@/lib/leads/lead-list';
import { submitLead } from '@/lib/leads/submit';
import { LeadAnswersSchema, LeadListQuerySchema } from '@/lib/schemas/lead';

/**
 * The leads, newest first, paged, optionally by ?status=. Each carries `staleDays` (days waited without
 * contact once past the shop's limit, else null); `staleTotal` counts such leads over every page.
 */
export const GET = route({ permission: 'leads.follow-up', query: LeadListQuerySchema }, async ({ query }) => {
  const { items, total, staleTotal, staleAfterDays } = await leadListPage(query);
  return NextResponse.json({ ...paged(items, total, query.page, query.pageSize), staleTotal, staleAfterDays });
});

/**
 * Public: the questionnaire's answers (lib/leads/submit.ts). No session to ride on, but the kit still
 * refuses another site's page posting leads in a visitor's name.
 */
export const POST = route({ permission: 'public', body: LeadAnswersSchema }, async ({ request, body }) =>
  NextResponse.json(await submitLead(body, clientIp(request.headers)), {
    status: 201,
    headers: { 'Cache-Control': 'no-store' },
  }),
);
