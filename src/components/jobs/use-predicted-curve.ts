'use client';

import useSWR from 'swr';
import { postForJson } from '@/lib/api-client';
import type { ChartCurve } from '@/components/advisor/power-chart';
import type { RankingResult } from '@/lib/advisor/types';
import type { BuildProfile } from '@/lib/schemas/build-profile';

// The advisor's predicted curve, with its band, for the cam fitted on this job, drawn over the measured
// pulls so the technician and the next customer see how close the prediction came. The model predicts
// corrected flywheel figures (SAE J1349 standard air), so it is only drawn over engine-dyno pulls: a
// chassis dyno reads at the wheels, after the driveline's losses.

async function predict([url, build, camId, buildId]: readonly [
  string,
  BuildProfile,
  number,
  number,
]): Promise<ChartCurve | null> {
  // This build's own pulls are left out of the shop history: the prediction must not learn from the
  // very result it is drawn against.
  const result = await postForJson<RankingResult>(url, {
    build,
    camIds: [camId],
    includeCurves: true,
    curveLimit: 1,
    excludeBuildId: buildId,
  });
  const ranked = result.rankings[0];
  if (!ranked?.curve.length) return null;
  const measured = ranked.history
    ? `, narrowed by ${ranked.history.matches} similar measured build${ranked.history.matches === 1 ? '' : 's'}`
    : '';
  return { label: `Predicted · ${ranked.camName} (advisor's model, shaded band${measured})`, points: ranked.curve };
}

export function usePredictedCurve(
  build: BuildProfile | null,
  buildId: number,
  camId: number | null,
  engineDyno: boolean,
) {
  const key = build && camId !== null && engineDyno ? (['/api/advisor/rank', build, camId, buildId] as const) : null;
  return useSWR(key, predict, { revalidateOnFocus: false });
}
