import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { parseQuery } from '@/lib/http/kit';
import { listBoard } from '@/lib/db/queries/job-board';
import { JobListQuerySchema } from '@/lib/schemas/job';

export const dynamic = 'force-dynamic';

/** GET /api/jobs?view=active|collected|all&from=&to=&page=&pageSize= — the board, paged. Technicians and managers. */
export async function GET(request: Request) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const query = parseQuery(request, JobListQuerySchema);
  if (!query.ok) return query.response;
  return NextResponse.json(await listBoard(query.value));
}
