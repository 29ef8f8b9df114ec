import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, paged, parseBody, parseQuery, withoutCosts } from '@/lib/catalogue/http';
import { createCam, listCams } from '@/lib/db/queries/cams';
import { CamListQuerySchema, CatalogueCamSchema } from '@/lib/schemas/catalogue-cam';

export const dynamic = 'force-dynamic';

/** The cam list: any staff member; paged, filtered and sorted on the server. */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const query = parseQuery(request, CamListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listCams(query.value);
  return NextResponse.json(paged(items.map((c) => withoutCosts(c, user)), total, query.value.page, query.value.pageSize));
}

/** A new cam: managers only. */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const body = await parseBody(request, CatalogueCamSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createCam(body.value, user), { status: 201, label: 'cam' });
}
