import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, paged, parseBody, parseQuery, withoutCosts } from '@/lib/http/kit';
import { createPart, listParts } from '@/lib/db/queries/parts';
import { PartListQuerySchema, PartSchema } from '@/lib/schemas/part';

export const dynamic = 'force-dynamic';

export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const query = parseQuery(request, PartListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listParts(query.value);
  return NextResponse.json(paged(items.map((p) => withoutCosts(p, user)), total, query.value.page, query.value.pageSize));
}

export async function POST(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const body = await parseBody(request, PartSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createPart(body.value, user), { status: 201, label: 'part' });
}
