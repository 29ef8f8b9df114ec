import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Attachments } from '@/components/catalogue/attachments';
import { deg, formatMoney, inches } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { ValveEventDiagram } from '@/components/catalogue/valve-diagram';
import { valveEvents } from '@/lib/advisor/valve-events';
import { requireAccessForPage } from '@/lib/auth/guard';
import { canSeeCosts } from '@/lib/auth/costs';
import { can } from '@/lib/auth/policy';
import { camCardOf } from '@/lib/catalogue/cam-card-of';
import { getCam } from '@/lib/db/queries/cams';

export const metadata: Metadata = { title: 'Cam' };

function Spec({ label, value, note }: { label: string; value: React.ReactNode; note?: string }) {
  return (
    <div className="flex flex-col border-b border-steel-100 py-1.5">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-muted">{label}</dt>
      <dd className="spec text-sm">{value}</dd>
      {note ? <dd className="text-xs text-ink-muted">{note}</dd> : null}
    </div>
  );
}

export default async function CamPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const user = await requireAccessForPage('catalogue.read');
  const { id } = await params;
  const query = await searchParams;
  if (!/^\d{1,10}$/.test(id)) notFound();
  const cam = await getCam(Number(id));
  if (!cam) notFound();
  const manager = can(user, 'catalogue.write');
  const card = camCardOf(cam);
  const events = valveEvents(card);
  const margin = cam.priceCents > 0 ? Math.round(((cam.priceCents - cam.costCents) / cam.priceCents) * 100) : null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={`${cam.sku} · ${cam.name}`}
        lead={cam.supplierName ?? 'Reference card (no supplier)'}
        back={{ href: '/catalogue/cams', label: 'Cams' }}
        actions={
          manager ? (
            <ButtonLink href={`/catalogue/cams/${cam.id}/edit`} variant="primary">
              Edit
            </ButtonLink>
          ) : null
        }
      />
      {query.saved ? (
        <Banner tone="ok" title="Saved">
          The cam is saved (version {cam.version}).
        </Banner>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {cam.archivedAt ? (
          <StateTag tone="muted">Archived {cam.archivedAt.slice(0, 10)}</StateTag>
        ) : cam.active ? (
          <StateTag tone="ok">Active</StateTag>
        ) : (
          <StateTag tone="caution">Inactive</StateTag>
        )}
        {cam.emissionsCertified ? (
          <StateTag tone="ok">Certified for emissions</StateTag>
        ) : (
          <StateTag tone="caution">Not certified for emissions</StateTag>
        )}
        {cam.deactivationCompatible ? (
          <StateTag tone="ok">Deactivation compatible</StateTag>
        ) : (
          <StateTag tone="caution">Needs deactivation deleted</StateTag>
        )}
        {cam.isFactoryBaseline ? (
          <StateTag tone="muted">
            Factory baseline{cam.baselineForLiters ? `, ${cam.baselineForLiters.toFixed(1)} L` : ''}
          </StateTag>
        ) : null}
      </div>
      <div className="grid gap-6 lg:grid-cols-2">
        <section aria-labelledby="card-title">
          <h2 id="card-title" className="text-lg font-semibold">
            Cam card
          </h2>
          <dl className="grid grid-cols-2 gap-x-6">
            <Spec
              label='Duration @0.050" in / ex'
              value={`${deg(cam.intakeDuration050)} / ${deg(cam.exhaustDuration050)}`}
            />
            <Spec label="Advertised in / ex" value={`${deg(cam.intakeAdvertised)} / ${deg(cam.exhaustAdvertised)}`} />
            <Spec
              label="Lift at the valve in / ex"
              value={`${inches(cam.intakeLiftIn)} / ${inches(cam.exhaustLiftIn)}`}
              note={`at ${cam.rockerRatio.toFixed(2)}:1 rocker ratio`}
            />
            <Spec label="Lobe separation angle" value={deg(cam.lsa)} />
            <Spec label="Installed intake centerline" value={`${deg(cam.intakeCenterline)} ATDC`} />
            <Spec label="Spring max lift" value={inches(cam.springMaxLiftIn)} />
            <Spec label="Price" value={formatMoney(cam.priceCents)} />
            {canSeeCosts(user) ? (
              <Spec
                label="Cost · margin"
                value={`${formatMoney(cam.costCents)} · ${margin === null ? '—' : `${margin} %`}`}
              />
            ) : null}
            <Spec label="Stock on hand" value={`${cam.stockOnHand} units`} />
            <Spec
              label="Version"
              value={cam.version}
              note={`last saved ${cam.updatedAt.slice(0, 16).replace('T', ' ')} UTC`}
            />
          </dl>
          {cam.notes ? <p className="mt-3 whitespace-pre-line text-sm text-ink-soft">{cam.notes}</p> : null}
        </section>
        <section aria-labelledby="events-title" className="flex flex-col gap-3">
          <h2 id="events-title" className="text-lg font-semibold">
            Valve events at 0.050&quot;
          </h2>
          <dl className="grid grid-cols-3 gap-x-4">
            <Spec label="IVO" value={`${events.ivo.toFixed(1)}° BTDC`} />
            <Spec label="IVC" value={`${events.ivc.toFixed(1)}° ABDC`} />
            <Spec label="Overlap" value={`${events.overlap.toFixed(1)}°`} />
            <Spec label="EVO" value={`${events.evo.toFixed(1)}° BBDC`} />
            <Spec label="EVC" value={`${events.evc.toFixed(1)}° ATDC`} />
            <Spec label="Exhaust centerline" value={`${events.exhaustCenterline.toFixed(1)}° BTDC`} />
          </dl>
          <p className="text-xs text-ink-muted">
            IVO = dur/2 − ICL, IVC = dur/2 + ICL − 180, ECL = 2·LSA − ICL, EVO = dur/2 + ECL − 180, EVC = dur/2 − ECL,
            overlap = IVO + EVC (standard cam-card arithmetic).
            {events.advertised
              ? ` At advertised duration the overlap is ${events.advertised.overlap.toFixed(1)}°.`
              : ''}
          </p>
          <ValveEventDiagram events={events} intakeLiftIn={cam.intakeLiftIn} exhaustLiftIn={cam.exhaustLiftIn} />
        </section>
      </div>
      <Attachments baseUrl={`/api/cams/${cam.id}`} canEdit={manager} />
    </div>
  );
}
