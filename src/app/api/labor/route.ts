import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, paged, parseBody, parseQuery } from '@/lib/http/kit';
import { createLabor, listLabor } from '@/lib/db/queries/labor';
import { LaborListQuerySchema, LaborSchema } from '@/lib/schemas/labor';

export const dynamic = 'force-dynamic';

export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const query = parseQuery(request, LaborListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listLabor(query.value);
  return NextResponse.json(paged(items, total, query.value.page, query.value.pageSize));
}

export async function POST(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const body = await parseBody(request, LaborSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createLabor(body.value, user), { status: 201, label: 'labour operation' });
}
