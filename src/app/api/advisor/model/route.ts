import { NextResponse } from 'next/server';
import { modelDetail } from '@/lib/advisor';
import { camCardsForRanking } from '@/lib/db/queries/advisor-cams';
import { invalidFields } from '@/lib/http/responses';
import { route } from '@/lib/http/route';
import { ModelDetailRequestSchema } from '@/lib/schemas/advisor-request';

/** The cycle model's own figures for one cam in one build ("how these numbers were reached"). */
export const POST = route(
  { permission: 'advisor.use', body: ModelDetailRequestSchema },
  async ({ body: { build, camId } }) => {
    if (camId === 'baseline') return NextResponse.json(modelDetail(build, build.baselineCam));
    const { cards, missingIds } = await camCardsForRanking([camId]);
    if (missingIds.length)
      throw invalidFields([{ field: 'camId', message: `no cam in the catalogue has id ${camId}` }]);
    return NextResponse.json(modelDetail(build, cards[0]));
  },
);
