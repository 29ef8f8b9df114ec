'use client';

import { buttonClass } from '@/components/catalogue/ui';

// The job sheet goes to the bench on paper; the print stylesheet drops the app around the page.
export function PrintButton({ label = 'Print the job sheet' }: { label?: string }) {
  return (
    <button type="button" className={`${buttonClass.quiet} print:hidden`} onClick={() => window.print()}>
      {label}
    </button>
  );
}
