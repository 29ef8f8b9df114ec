import { NextResponse } from 'next/server';
import { createBuild, listBuilds } from '@/lib/db/queries/builds';
import { outcomeResponse, paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { BuildCreateSchema, BuildListQuerySchema } from '@/lib/schemas/build';

/** Recent builds, newest first, searchable by vehicle or customer. */
export const GET = route({ permission: 'builds.read', query: BuildListQuerySchema }, async ({ query }) => {
  const { items, total } = await listBuilds(query);
  return NextResponse.json(paged(items, total, query.page, query.pageSize));
});

/**
 * A build from the counter interview: an existing customer's id or a new customer inline, the vehicle,
 * and the build profile (checked by the advisor's own schema).
 */
export const POST = route({ permission: 'builds.write', body: BuildCreateSchema }, async ({ user, body }) =>
  outcomeResponse(await createBuild(body, user), { status: 201, label: 'build' }),
);
