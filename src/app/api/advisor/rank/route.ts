import { NextResponse } from 'next/server';
import { rankForShop } from '@/lib/advisor-service';
import { requireRole } from '@/lib/auth/guard';
import { readJson, validationFailed } from '@/lib/http/responses';
import { RankRequestSchema } from '@/lib/schemas/advisor-request';

export const dynamic = 'force-dynamic';

// Ranks the shop's cams for one build. Any signed-in staff member may ask.
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = RankRequestSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);
  const outcome = await rankForShop(parsed.data.build, { camIds: parsed.data.camIds, includeCurves: parsed.data.includeCurves, curveLimit: parsed.data.curveLimit });
  if (!outcome.ok) {
    return validationFailed([{ field: 'camIds', message: `no cam in the catalogue has id ${outcome.missingIds.join(', ')}` }]);
  }
  return NextResponse.json(outcome.result);
}
