import type { Metadata } from 'next';
import { ShortlistWorkbench } from '@/components/advisor/shortlist-workbench';
import { PREDICTION_NOTICE } from '@/lib/advisor';
import { requireRoleForPage } from '@/lib/auth/guard';
import { listBuildSummaries } from '@/lib/db/queries/builds';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';

export const metadata: Metadata = { title: 'Cam shortlist' };

export default async function AdvisorPage() {
  await requireRoleForPage('manager', 'counter', 'tech');
  const builds = (await listBuildSummaries())
    .map((b) => ({ ...b, parsed: BuildProfileSchema.safeParse(b.profile) }))
    .filter((b) => b.parsed.success)
    .map((b) => ({ id: b.id, label: `${b.customerName} — ${b.vehicleLabel}`, profile: b.parsed.data! }));
  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-2xl font-semibold">Cam shortlist</h1>
        <p className="text-sm text-ink-soft">Pick a saved build; the shop’s cams are ranked for it, best fit first.</p>
      </header>
      <ShortlistWorkbench builds={builds} notice={PREDICTION_NOTICE} />
    </div>
  );
}
