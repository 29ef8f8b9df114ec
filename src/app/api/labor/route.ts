import { NextResponse } from 'next/server';
import { createLabor, listLabor } from '@/lib/db/queries/labor';
import { outcomeResponse, paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { LaborListQuerySchema, LaborSchema } from '@/lib/schemas/labor';

export const GET = route({ permission: 'catalogue.read', query: LaborListQuerySchema }, async ({ query }) => {
  const { items, total } = await listLabor(query);
  return NextResponse.json(paged(items, total, query.page, query.pageSize));
});

export const POST = route({ permission: 'catalogue.write', body: LaborSchema }, async ({ user, body }) =>
  outcomeResponse(await createLabor(body, user), { status: 201, label: 'labour operation' }),
);
