import { NextResponse } from 'next/server';
import { createPart, listParts } from '@/lib/db/queries/parts';
import { withoutCosts } from '@/lib/auth/costs';
import { outcomeResponse, paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { PartListQuerySchema, PartSchema } from '@/lib/schemas/part';

export const GET = route({ permission: 'catalogue.read', query: PartListQuerySchema }, async ({ user, query }) => {
  const { items, total } = await listParts(query);
  return NextResponse.json(
    paged(
      items.map((p) => withoutCosts(p, user)),
      total,
      query.page,
      query.pageSize,
    ),
  );
});

export const POST = route({ permission: 'catalogue.write', body: PartSchema }, async ({ user, body }) =>
  outcomeResponse(await createPart(body, user), { status: 201, label: 'part' }),
);
