'use client';

import { Button } from '@/components/ui/button';

// The job sheet goes to the bench on paper; the print stylesheet drops the app around the page.
export function PrintButton({ label = 'Print the job sheet' }: { label?: string }) {
  return (
    <Button type="button" variant="quiet" className="print:hidden" onClick={() => window.print()}>
      {label}
    </Button>
  );
}
