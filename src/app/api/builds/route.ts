import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, paged, parseBody, parseQuery } from '@/lib/http/kit';
import { createBuild, listBuilds } from '@/lib/db/queries/builds';
import { BuildCreateSchema, BuildListQuerySchema } from '@/lib/schemas/build';

export const dynamic = 'force-dynamic';

/** Recent builds, newest first, searchable by vehicle or customer: any staff member. */
export async function GET(request: Request) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const query = parseQuery(request, BuildListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listBuilds(query.value);
  return NextResponse.json(paged(items, total, query.value.page, query.value.pageSize));
}

/**
 * A build from the counter interview: an existing customer's id or a new customer inline, the vehicle,
 * and the build profile (checked by the advisor's own schema). Managers and counter staff.
 */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const body = await parseBody(request, BuildCreateSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createBuild(body.value, user), { status: 201, label: 'build' });
}
