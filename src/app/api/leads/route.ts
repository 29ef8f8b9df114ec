import { NextResponse } from 'next/server';
import { clientIp } from '@/lib/auth/request-info';
import { listLeads } from '@/lib/db/queries/leads';
import { paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { submitLead } from '@/lib/leads/submit';
import { LeadAnswersSchema, LeadListQuerySchema } from '@/lib/schemas/lead';

/** The leads, newest first, paged, optionally by ?status=. */
export const GET = route({ permission: 'leads.follow-up', query: LeadListQuerySchema }, async ({ query }) => {
  const { items, total } = await listLeads(query);
  return NextResponse.json(paged(items, total, query.page, query.pageSize));
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
