'use client';

import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { COMPARE_MAX, COMPARE_MIN } from '@/lib/shortlist/comparison';
import { CamComparison } from './cam-comparison';
import { CustomerView, type CustomerViewProps } from './customer-view';

// The cams charted on the shortlist are the ones the counter person has chosen: two or three of them can be
// compared side by side here, or shown to the customer in the customer view.
export function ChosenCams({ cams, ...view }: Omit<CustomerViewProps, 'onClose'>) {
  const [comparing, setComparing] = useState(false);
  const [showing, setShowing] = useState(false);
  const panel = useId();
  const opener = useId();
  const ready = cams.length >= COMPARE_MIN && cams.length <= COMPARE_MAX;
  // Back where the person left off once the view has gone (the page under an open modal cannot take focus):
  // the button that opened it (the kit's Button takes no ref, so it is found by its id).
  const wasShowing = useRef(false);
  useEffect(() => {
    if (wasShowing.current && !showing) document.getElementById(opener)?.focus();
    wasShowing.current = showing;
  }, [showing, opener]);
  const close = () => setShowing(false);

  return (
    <section
      aria-label="Chosen cams"
      className="flex flex-col gap-3 rounded-lg border border-steel-300 bg-paper-raised p-3"
    >
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        <p role="status" className="text-ink-soft">
          {ready
            ? `Chosen: ${cams.map((c) => c.camName).join(', ')} (the cams on the chart).`
            : `Chart ${COMPARE_MIN} or ${COMPARE_MAX} cams to compare them or show them to the customer (${cams.length} on the chart now).`}
        </p>
        <div className="flex flex-wrap gap-2">
          <Button
            aria-expanded={comparing && ready}
            aria-controls={panel}
            disabled={!ready}
            onClick={() => setComparing((on) => !on)}
          >
            {comparing && ready ? 'Hide the comparison' : 'Compare side by side'}
          </Button>
          <Button id={opener} variant="primary" disabled={!ready} onClick={() => setShowing(true)}>
            Show to the customer
          </Button>
        </div>
      </div>
      <div id={panel} hidden={!(comparing && ready)}>
        {comparing && ready ? <CamComparison cams={cams} caption="Chosen cams side by side" /> : null}
      </div>
      {showing && ready ? <CustomerView cams={cams} {...view} onClose={close} /> : null}
    </section>
  );
}
