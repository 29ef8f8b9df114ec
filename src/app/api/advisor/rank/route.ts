import { NextResponse } from 'next/server';
import { rankForShop } from '@/lib/ranking/rank-for-shop';
import { invalidFields } from '@/lib/http/responses';
import { route } from '@/lib/http/route';
import { RankRequestSchema } from '@/lib/schemas/advisor-request';

/** Ranks the shop's cams for one build. */
export const POST = route(
  { permission: 'advisor.use', body: RankRequestSchema },
  async ({ body: { build, camIds, includeCurves, curveLimit, excludeBuildId } }) => {
    const outcome = await rankForShop(build, { camIds, includeCurves, curveLimit, excludeBuildId });
    if (!outcome.ok)
      throw invalidFields([
        { field: 'camIds', message: `no cam in the catalogue has id ${outcome.missingIds.join(', ')}` },
      ]);
    return NextResponse.json(outcome.result);
  },
);
