import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import { DynoPanel } from '@/components/jobs/dyno-panel';
import { JobProgress } from '@/components/jobs/job-progress';
import { PrintButton } from '@/components/jobs/print-button';
import { SignOffForm } from '@/components/jobs/sign-off-form';
import { SignOffSheet } from '@/components/jobs/sign-off-sheet';
import { displacementCi, litresFromCubicInches } from '@/lib/advisor/geometry';
import { valveEvents } from '@/lib/advisor/valve-events';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getBoardJob, listAssignableStaff } from '@/lib/db/queries/job-board';
import { getJobSheet } from '@/lib/db/queries/jobs';
import { getDynoAirUnits } from '@/lib/db/queries/settings';
import { words } from '@/lib/jobs/build-words';
import { SIGN_OFF_STATES, type JobState } from '@/lib/jobs/states';
import { stateWord } from '@/lib/quotes/lifecycle';

export const metadata: Metadata = { title: 'Job' };

function Spec({ label, value }: { label: string; value: React.ReactNode }) {
  return (
    <div className="flex flex-col border-b border-steel-100 py-1.5">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-muted">{label}</dt>
      <dd className="spec text-sm">{value}</dd>
    </div>
  );
}

const deg = (n: number) => `${n.toFixed(1)}°`;
const inch = (n: number, digits = 3) => `${n.toFixed(digits)} in`;
const KIND_WORDS: Record<string, string> = { cam: 'Cam', part: 'Part', tune: 'Tune', labor: 'Labour', other: 'Other' };

export default async function JobPage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('jobs.read');
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) notFound();
  const job = await getJobSheet(Number(id));
  if (!job) notFound();
  // Only a deposit-paid quote is on the board; an accepted, unpaid one still shows its sheet.
  const [board, staff, airUnits] = await Promise.all([
    getBoardJob(job.quoteId),
    listAssignableStaff(),
    getDynoAirUnits(),
  ]);
  const p = job.profile;
  const ci = p ? displacementCi(p.engine.boreIn, p.engine.strokeIn, p.engine.cylinders) : null;
  const events = job.cam ? valveEvents(job.cam) : null;
  const parts = job.lines.filter((l) => l.kind !== 'labor');
  const labour = job.lines.filter((l) => l.kind === 'labor');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={`${job.number} · ${job.vehicleLabel}`}
        lead={
          <>
            {job.customerName} ·{' '}
            <StateTag tone={job.status === 'accepted' ? 'muted' : 'ok'}>{stateWord(job.status)}</StateTag>
          </>
        }
        back={{ href: '/jobs', label: 'Jobs' }}
        actions={<PrintButton />}
      />

      <section
        aria-labelledby="cautions-title"
        className="rounded border border-caution-700/40 bg-caution-100 p-3 text-sm text-caution-700"
      >
        <h2 id="cautions-title" className="font-semibold">
          Before the engine runs
        </h2>
        <ul className="mt-1 list-disc pl-5">
          <li>
            Valve springs (seat and open pressure, coil bind), piston-to-valve clearance and pushrod length must be
            checked by a qualified technician on this engine.
          </li>
          <li>The engine must be re-tuned after the swap; record the dyno pulls on the tuned engine.</li>
          {p?.engine.cylinderDeactivation === 'active' ? (
            <li>
              This engine has cylinder deactivation working: delete it with the kit on the quote, or fit only a cam and
              tune made for it.
            </li>
          ) : null}
          {p?.use.emissionsRequired ? (
            <li>The vehicle must pass emissions: fit only what the quote names and keep the catalytic converters.</li>
          ) : null}
          <li>Local codes and licensed practice come first.</li>
        </ul>
      </section>

      {board ? <JobProgress job={board} staff={staff} /> : null}

      <h2 className="text-lg font-semibold">Build sheet</h2>
      <div className="grid gap-6 lg:grid-cols-2">
        <section aria-labelledby="engine-title">
          <h3 id="engine-title" className="font-semibold">
            Engine combination
          </h3>
          {p && ci !== null ? (
            <dl className="grid grid-cols-2 gap-x-6">
              <Spec
                label="Displacement"
                value={`${ci.toFixed(0)} in³ (${litresFromCubicInches(ci).toFixed(1)} L), ${p.engine.cylinders} cylinders`}
              />
              <Spec label="Bore × stroke" value={`${inch(p.engine.boreIn)} × ${inch(p.engine.strokeIn)}`} />
              <Spec label="Rod length" value={inch(p.engine.rodLengthIn)} />
              <Spec label="Static compression" value={`${p.engine.compressionRatio.toFixed(1)}:1`} />
              <Spec
                label="Heads"
                value={`${words.heads(p.engine.headMaterial)}, ${p.engine.intakeFlowCfm} cfm @ 28 inH₂O`}
              />
              <Spec label="Intake manifold" value={words.intake(p.engine.intakeManifold)} />
              <Spec label="Cylinder deactivation" value={words.deactivation(p.engine.cylinderDeactivation)} />
              <Spec
                label="Headers · exhaust"
                value={`${words.headers(p.exhaust.headers)}${p.exhaust.primaryIn && p.exhaust.headers !== 'manifold' ? `, ${inch(p.exhaust.primaryIn, 3)} primaries` : ''} · ${words.exhaust(p.exhaust.system)}`}
              />
              <Spec
                label="Transmission · stall"
                value={`${words.transmission(p.drivetrain.transmission)}${p.drivetrain.stallRpm ? ` · ${p.drivetrain.stallRpm.toLocaleString('en-US')} rpm stall` : ''}`}
              />
              <Spec
                label="Axle ratio · tyre"
                value={`${p.drivetrain.axleRatio.toFixed(2)}:1 · ${p.drivetrain.tireDiameterIn} in`}
              />
              <Spec label="Cam coming out" value={p.baselineCam.name} />
              <Spec label="Fuel" value={`${p.use.fuelOctane} octane`} />
              <Spec label="Brakes" value={words.brakes(p.vehicle.powerBrakes)} />
              <Spec label="Use" value={words.use(p.use.primary)} />
            </dl>
          ) : (
            <p className="text-sm text-fault-700">The saved build could not be read; ask the counter to check it.</p>
          )}
        </section>
        <section aria-labelledby="cam-title">
          <h3 id="cam-title" className="font-semibold">
            Cam going in
          </h3>
          {job.cam && events ? (
            <>
              <p className="spec text-sm">{job.cam.name}</p>
              <dl className="grid grid-cols-2 gap-x-6">
                <Spec
                  label='Duration @0.050" in / ex'
                  value={`${deg(job.cam.intakeDuration050)} / ${deg(job.cam.exhaustDuration050)}`}
                />
                <Spec
                  label="Lift at the valve in / ex"
                  value={`${inch(job.cam.intakeLiftIn)} / ${inch(job.cam.exhaustLiftIn)} (${(job.cam.rockerRatio ?? 1.7).toFixed(2)}:1 rocker)`}
                />
                <Spec label="Lobe separation angle" value={deg(job.cam.lsa)} />
                <Spec label="Installed intake centerline" value={`${deg(job.cam.intakeCenterline)} ATDC`} />
              </dl>
              <h4 className="mt-3 text-sm font-semibold">Valve events at 0.050&quot;</h4>
              <dl className="grid grid-cols-3 gap-x-4">
                <Spec label="IVO" value={`${deg(events.ivo)} BTDC`} />
                <Spec label="IVC" value={`${deg(events.ivc)} ABDC`} />
                <Spec label="Overlap" value={deg(events.overlap)} />
                <Spec label="EVO" value={`${deg(events.evo)} BBDC`} />
                <Spec label="EVC" value={`${deg(events.evc)} ATDC`} />
                <Spec label="Exhaust centerline" value={`${deg(events.exhaustCenterline)} BTDC`} />
              </dl>
              <p className="mt-1 text-xs text-ink-muted">
                Degree the cam in at the installed intake centerline above. Events from standard cam-card arithmetic
                (IVO = dur/2 − ICL, IVC = dur/2 + ICL − 180, ECL = 2·LSA − ICL).
              </p>
              {job.cam.supplierNotes ? <p className="mt-2 text-sm text-ink-soft">{job.cam.supplierNotes}</p> : null}
            </>
          ) : (
            <p className="text-sm text-ink-soft">This quote names no cam.</p>
          )}
        </section>
      </div>

      <section aria-labelledby="parts-title">
        <h3 id="parts-title" className="font-semibold">
          Parts to pull and work
        </h3>
        <table className={tableClass}>
          <caption className="sr-only">Parts and labour on the quote, without prices</caption>
          <thead>
            <tr>
              <th scope="col" className={thClass}>
                What
              </th>
              <th scope="col" className={thClass}>
                Item
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Quantity
              </th>
              <th scope="col" className={thClass}>
                Pulled
              </th>
            </tr>
          </thead>
          <tbody>
            {[...parts, ...labour].map((line, i) => (
              <tr key={i}>
                <td className={tdClass}>{KIND_WORDS[line.kind] ?? line.kind}</td>
                <td className={tdClass}>{line.description}</td>
                <td className={`${tdClass} spec text-right`}>
                  {line.kind === 'labor' ? `${line.quantity.toFixed(1)} h` : `${line.quantity} ×`}
                </td>
                <td className={tdClass}>
                  {line.kind === 'labor' || line.kind === 'tune' ? (
                    ''
                  ) : (
                    <span aria-hidden="true" className="inline-block h-3.5 w-3.5 border border-ink-muted" />
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      {board ? (
        <section aria-labelledby="checks-title" className="flex flex-col gap-3">
          <h2 id="checks-title" className="text-lg font-semibold">
            Checks before first start
          </h2>
          {board.signOff ? (
            <SignOffSheet signOff={board.signOff} />
          ) : (
            <p className="text-sm text-ink-soft">
              No sign-off recorded yet. The job cannot be marked ready without one.
            </p>
          )}
          {SIGN_OFF_STATES.includes(board.state as JobState) ? (
            <SignOffForm jobId={board.id} deactivationActive={board.deactivationActive} />
          ) : null}
        </section>
      ) : null}

      {job.buildId !== null ? (
        <DynoPanel buildId={job.buildId} quoteId={job.quoteId} profile={p} units={airUnits} />
      ) : null}
    </div>
  );
}
