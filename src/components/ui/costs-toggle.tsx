'use client';

import { useSyncExternalStore } from 'react';

// What the shop pays (costs, margins) stays off screens that may face a customer until the person who may see
// it asks: one toggle, remembered in this browser (localStorage). Whether costs reach the page at all is the
// server's decision (`costs.read`, src/lib/auth/costs.ts): without them there is no toggle.

const KEY = 'lobewise.show-costs';
const listeners = new Set<() => void>();

function subscribe(listener: () => void) {
  listeners.add(listener);
  window.addEventListener('storage', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', listener);
  };
}

const read = () => window.localStorage.getItem(KEY) === 'yes';

/** Whether this browser asked to see costs; false on the server and before anyone asked. */
export function useCostsShown(): [boolean, (shown: boolean) => void] {
  const shown = useSyncExternalStore(subscribe, read, () => false);
  const set = (next: boolean) => {
    window.localStorage.setItem(KEY, next ? 'yes' : 'no');
    for (const listener of listeners) listener();
  };
  return [shown, set];
}

export function CostsToggle({ shown, onChange }: { shown: boolean; onChange: (shown: boolean) => void }) {
  return (
    <button
      type="button"
      aria-pressed={shown}
      onClick={() => onChange(!shown)}
      className="rounded px-2 py-1 text-sm ring-1 ring-steel-300 hover:ring-gauge-500"
    >
      {shown ? 'Hide costs and margins' : 'Show costs and margins'}
    </button>
  );
}
