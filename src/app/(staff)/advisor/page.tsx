import type { Metadata } from 'next';
import { ShortlistWorkbench } from '@/components/advisor/shortlist-workbench';
import { PREDICTION_NOTICE } from '@/lib/advisor';
import { requireRoleForPage } from '@/lib/auth/guard';
import { getBuildSummary, listBuildSummaries } from '@/lib/db/queries/builds';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';

export const metadata: Metadata = { title: 'Cam shortlist' };

export default async function AdvisorPage({ searchParams }: { searchParams: Promise<{ build?: string | string[] }> }) {
  await requireRoleForPage('manager', 'counter', 'tech');
  // ?build=<id> (the interview lands here after saving) preselects that build, even beyond the newest.
  const wanted = Number((await searchParams).build);
  const summaries = await listBuildSummaries();
  if (Number.isSafeInteger(wanted) && wanted > 0 && !summaries.some((b) => b.id === wanted)) {
    const extra = await getBuildSummary(wanted);
    if (extra) summaries.unshift(extra);
  }
  const builds = summaries
    .map((b) => ({ ...b, parsed: BuildProfileSchema.safeParse(b.profile) }))
    .filter((b) => b.parsed.success)
    .map((b) => ({ id: b.id, label: `${b.customerName} — ${b.vehicleLabel}`, profile: b.parsed.data! }));
  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-2xl font-semibold">Cam shortlist</h1>
        <p className="text-sm text-ink-soft">Pick a saved build; the shop’s cams are ranked for it, best fit first.</p>
      </header>
      <ShortlistWorkbench builds={builds} notice={PREDICTION_NOTICE} initialBuildId={builds.some((b) => b.id === wanted) ? wanted : undefined} />
    </div>
  );
}
