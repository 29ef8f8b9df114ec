'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { sendJson } from '@/lib/api-client';

export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        await sendJson('POST', '/api/auth/sign-out'); // signed out or not, the sign-in page is next
        router.push('/sign-in');
        router.refresh();
      }}
      className="rounded px-3 py-1.5 ring-1 ring-steel-500 hover:bg-steel-900 disabled:opacity-60"
    >
      {busy ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
