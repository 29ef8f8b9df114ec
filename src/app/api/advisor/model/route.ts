import { NextResponse } from 'next/server';
import { modelDetail } from '@/lib/advisor';
import { requireRole } from '@/lib/auth/guard';
import { camCardsForRanking } from '@/lib/db/queries/advisor-cams';
import { readJson, validationFailed } from '@/lib/http/responses';
import { ModelDetailRequestSchema } from '@/lib/schemas/advisor-request';

export const dynamic = 'force-dynamic';

// The cycle model's own figures for one cam in one build ("how these numbers were reached"). Staff only.
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = ModelDetailRequestSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);
  const { build, camId } = parsed.data;
  if (camId === 'baseline') return NextResponse.json(modelDetail(build, build.baselineCam));
  const { cards, missingIds } = await camCardsForRanking([camId]);
  if (missingIds.length) return validationFailed([{ field: 'camId', message: `no cam in the catalogue has id ${camId}` }]);
  return NextResponse.json(modelDetail(build, cards[0]));
}
