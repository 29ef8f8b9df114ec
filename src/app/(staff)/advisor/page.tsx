import type { Metadata } from 'next';
import { z } from 'zod';
import { ShortlistWorkbench } from '@/components/advisor/shortlist-workbench';
import { PREDICTION_NOTICE } from '@/lib/advisor';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getBuildSummary, listBuildSummaries } from '@/lib/db/queries/builds';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';

export const metadata: Metadata = { title: 'Cam shortlist' };

// ?build=<id> (the interview lands here after saving) preselects that build, even beyond the newest.
// Without it, or when it names no readable build, nothing is preselected: showing some other
// customer's build instead would put the wrong engine in front of the person at the counter.
const BuildParam = z
  .string()
  .regex(/^\d{1,10}$/)
  .transform(Number)
  .pipe(z.number().int().positive().max(Number.MAX_SAFE_INTEGER));

export default async function AdvisorPage({ searchParams }: { searchParams: Promise<{ build?: string | string[] }> }) {
  await requireAccessForPage('advisor.use');
  const raw = (await searchParams).build;
  const given = Array.isArray(raw) ? raw[0] : raw;
  const parsed = given === undefined ? null : BuildParam.safeParse(given.trim());
  const wanted = parsed?.success ? parsed.data : undefined;
  const summaries = await listBuildSummaries();
  if (wanted !== undefined && !summaries.some((b) => b.id === wanted)) {
    const extra = await getBuildSummary(wanted);
    if (extra) summaries.unshift(extra);
  }
  const found = wanted !== undefined && summaries.some((b) => b.id === wanted);
  const builds = summaries
    .map((b) => ({ ...b, parsed: BuildProfileSchema.safeParse(b.profile) }))
    .filter((b) => b.parsed.success)
    .map((b) => ({ id: b.id, label: `${b.customerName} — ${b.vehicleLabel}`, profile: b.parsed.data! }));
  const readable = wanted !== undefined && builds.some((b) => b.id === wanted);

  let problem: string | null = null;
  if (parsed && !parsed.success) problem = `“${given!.slice(0, 40)}” is not a build number. Pick a build below.`;
  else if (wanted !== undefined && !found)
    problem = `Build ${wanted} was not found: it may have been deleted, or the link is mistyped. Pick a build below.`;
  else if (wanted !== undefined && !readable)
    problem = `Build ${wanted} cannot be read; open it from Interviews and save it again, or pick another build below.`;

  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-2xl font-semibold">Cam shortlist</h1>
        <p className="text-sm text-ink-soft">Pick a saved build; the shop’s cams are ranked for it, best fit first.</p>
      </header>
      {problem ? (
        <p role="alert" className="rounded border border-fault-700/40 bg-fault-100 p-3 text-sm text-fault-700">
          <span className="font-semibold">Not found:</span> {problem}
        </p>
      ) : null}
      <ShortlistWorkbench builds={builds} notice={PREDICTION_NOTICE} initialBuildId={readable ? wanted : undefined} />
    </div>
  );
}
