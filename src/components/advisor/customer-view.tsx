'use client';

import { useEffect, useRef } from 'react';
import { createPortal } from 'react-dom';
import { Button } from '@/components/ui/button';
import { formatNumber } from '@/lib/format';
import { CUSTOMER_CAUTIONS } from '@/lib/quotes/cautions';
import { customerCam, customerCamName } from '@/lib/shortlist/customer-words';
import type { ComparedCam } from '@/lib/shortlist/comparison';
import { CamComparison } from './cam-comparison';
import { PowerChart, type ChartPoint } from './power-chart';

export type CustomerViewProps = {
  cams: readonly (ComparedCam & { curve: ChartPoint[] })[];
  baseline: { curve: ChartPoint[] };
  displacementL: number;
  stallRpm: number;
  drivenBand: { fromRpm: number; toRpm: number };
  notice: string;
  onClose: () => void;
};

// The shortlist turned round for the customer at the counter: large type, plain words, the chosen cams'
// curves, the side-by-side comparison and the whole-job price, with the cautions every cam swap carries.
// A modal <dialog> on top of the staff page: the page underneath is inert, Escape closes it, and it prints
// alone (globals.css hides the rest of the body while it is open), so nothing of the staff screen shows.
export function CustomerView({
  cams,
  baseline,
  displacementL,
  stallRpm,
  drivenBand,
  notice,
  onClose,
}: CustomerViewProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const element = dialog.current;
    if (element && !element.open) element.showModal();
    // The way back takes the focus (showModal would give it to the first control; say it, not rely on order).
    element?.querySelector<HTMLButtonElement>('[data-close-view]')?.focus();
    return () => element?.close();
  }, []);
  const told = cams.map(customerCam);

  return createPortal(
    <dialog
      ref={dialog}
      aria-labelledby="customer-view-title"
      data-print-alone
      data-customer-view
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className="m-0 h-full max-h-none w-full max-w-none overflow-y-auto bg-paper p-0 text-ink backdrop:bg-paper print:static print:h-auto print:overflow-visible"
    >
      <div className="mx-auto flex max-w-6xl flex-col gap-6 px-4 py-6 text-lg sm:px-8">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h2 id="customer-view-title" className="text-3xl font-semibold sm:text-4xl">
              Your cam choices
            </h2>
            <p className="mt-1 text-ink-soft">
              For your {formatNumber(displacementL, 1, 'L')} engine: {cams.length} cams side by side, with what each one
              does and what the whole job comes to.
            </p>
          </div>
          <div className="flex flex-wrap gap-2 print:hidden">
            <Button size="md" variant="primary" className="min-h-12" onClick={onClose} data-close-view>
              Back to the shop view
            </Button>
            <Button size="md" className="min-h-12" onClick={() => window.print()}>
              Print
            </Button>
          </div>
        </div>

        <section
          aria-labelledby="customer-chart-title"
          className="rounded-lg border border-steel-300 bg-paper-raised p-4 break-inside-avoid"
        >
          <h3 id="customer-chart-title" className="text-xl font-semibold">
            How each cam pulls against your engine now
          </h3>
          <PowerChart
            baseline={{ label: 'Your engine now', points: baseline.curve }}
            candidates={cams.map((c) => ({ label: customerCamName(c), points: c.curve }))}
            markers={stallRpm > 0 ? [{ label: 'Converter stall', rpm: stallRpm }] : []}
            band={{ ...drivenBand, label: 'Where you usually drive' }}
            description={`Estimated pulling power (torque) against engine speed for your engine now and for ${cams.map(customerCamName).join(', ')}`}
            initialMetric="torque"
          />
          <p className="mt-2 text-base text-ink-muted">{notice}</p>
        </section>

        <ul className="grid gap-4 md:grid-cols-3" aria-label="The chosen cams">
          {told.map((cam) => (
            <li
              key={String(cam.camId)}
              className="flex flex-col gap-3 rounded-lg border border-steel-300 bg-paper-raised p-4 break-inside-avoid"
              data-customer-cam
            >
              <h3 className="text-2xl font-semibold">{cam.name}</h3>
              <p>
                <span className="block text-base text-ink-muted">Whole job, before tax</span>
                <span className="text-3xl font-semibold tabular-nums" data-customer-price>
                  {cam.jobPrice}
                </span>
              </p>
              <Lines lines={cam.does} />
              {cam.includes.length ? <Lines title="The job includes" lines={cam.includes} /> : null}
              {cam.knowFirst.length ? (
                <Lines
                  title="Good to know"
                  lines={cam.knowFirst}
                  className="rounded border border-caution-700/40 bg-caution-100 p-3 text-caution-700"
                />
              ) : null}
            </li>
          ))}
        </ul>

        <section aria-labelledby="customer-compare-title" className="flex flex-col gap-2">
          <h3 id="customer-compare-title" className="text-xl font-semibold">
            Side by side
          </h3>
          <CamComparison cams={cams} forCustomer caption="The chosen cams side by side" />
        </section>

        <section
          aria-labelledby="customer-cautions-title"
          className="rounded-lg border border-caution-700/40 bg-caution-100 p-4 text-ink break-inside-avoid"
          data-customer-cautions
        >
          <h3 id="customer-cautions-title" className="text-xl font-semibold">
            Before any cam goes in
          </h3>
          <ul className="mt-2 flex list-disc flex-col gap-1.5 pl-5">
            {CUSTOMER_CAUTIONS.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </section>
      </div>
    </dialog>,
    document.body,
  );
}

function Lines({ title, lines, className = '' }: { title?: string; lines: readonly string[]; className?: string }) {
  return (
    <div className={className}>
      {title ? <h4 className="font-semibold">{title}</h4> : null}
      <ul className="flex list-disc flex-col gap-1 pl-5">
        {lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </div>
  );
}
