import { NextResponse } from 'next/server';
import { listBoard } from '@/lib/db/queries/job-board';
import { route } from '@/lib/http/route';
import { JobListQuerySchema } from '@/lib/schemas/job';

/** GET /api/jobs?view=active|collected|all&from=&to=&page=&pageSize= — the board, paged. */
export const GET = route({ permission: 'jobs.read', query: JobListQuerySchema }, async ({ query }) =>
  NextResponse.json(await listBoard(query)),
);
