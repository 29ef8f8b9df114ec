'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { sendJson } from '@/lib/api-client';
import { Button } from '@/components/ui/button';

/** On the shortlist: turns the build and this cam into a draft quote and opens it. */
export function MakeQuoteButton({ buildId, camId }: { buildId: number; camId: number | string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="mt-3">
      <Button
        type="button"
        variant="primary"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          const { status, body } = await sendJson<{ id: number }>('POST', '/api/quotes', {
            buildId,
            camId: Number(camId),
          });
          if (status === 201) return router.push(`/quotes/${body.id}`);
          setBusy(false);
          setError(
            body.errors?.map((e) => `${e.field}: ${e.message}`).join('; ') ??
              body.message ??
              `The server answered ${status}.`,
          );
        }}
      >
        {busy ? 'Making the quote…' : 'Make a quote'}
      </Button>
      {error ? (
        <p role="alert" className="mt-1 text-sm text-fault-700">
          Not made: {error}
        </p>
      ) : null}
    </div>
  );
}
