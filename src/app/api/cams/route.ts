import { NextResponse } from 'next/server';
import { createCam, listCams } from '@/lib/db/queries/cams';
import { withoutCosts } from '@/lib/auth/costs';
import { outcomeResponse, paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { CamListQuerySchema, CatalogueCamSchema } from '@/lib/schemas/catalogue-cam';

/** The cam list: any staff member; paged, filtered and sorted on the server. */
export const GET = route({ permission: 'catalogue.read', query: CamListQuerySchema }, async ({ user, query }) => {
  const { items, total } = await listCams(query);
  return NextResponse.json(
    paged(
      items.map((c) => withoutCosts(c, user)),
      total,
      query.page,
      query.pageSize,
    ),
  );
});

/** A new cam. */
export const POST = route({ permission: 'catalogue.write', body: CatalogueCamSchema }, async ({ user, body }) =>
  outcomeResponse(await createCam(body, user), { status: 201, label: 'cam' }),
);
