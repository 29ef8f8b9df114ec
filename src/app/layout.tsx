import type { Metadata, Viewport } from 'next';
import Link from 'next/link';
import { StaffHeaderNav } from '@/components/auth/staff-header-nav';
import { getShopNameOrNull } from '@/lib/db/queries/settings';
import { bodyFont, specFont } from './fonts';
import './globals.css';

export const dynamic = 'force-dynamic';

export const metadata: Metadata = {
  title: { default: 'Lobewise', template: '%s · Lobewise' },
  description: 'Cam-swap advice, quotes and dyno records for performance shops.',
  // public/: the installable-app manifest and the home-screen icon. Naming any icon here replaces the link
  // Next writes for app/icon.svg, so the tab icons are listed too: the SVG, and favicon.ico for browsers without SVG icons.
  manifest: '/site.webmanifest',
  icons: {
    icon: [
      { url: '/favicon.ico', sizes: '32x32' },
      { url: '/icon.svg', type: 'image/svg+xml' },
    ],
    apple: '/apple-touch-icon.png',
  },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const shopName = await getShopNameOrNull();
  return (
    <html lang="en" className={`${bodyFont.variable} ${specFont.variable}`}>
      <body className="flex min-h-screen flex-col font-sans">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper-raised focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        <header className="border-b border-steel-300 bg-ink text-paper">
          {/* Wider than the pages below it so a manager's eleven links, name and sign-out fit one row at 1280 px. */}
          <div className="mx-auto flex max-w-7xl items-center justify-between gap-4 px-4 py-3">
            {/* No prefetch: on a customer's phone the start page's data would compete with the page being read. */}
            <Link href="/" prefetch={false} className="flex items-baseline gap-2 text-lg font-semibold tracking-tight">
              <span aria-hidden className="inline-block h-3 w-3 rotate-45 rounded-sm bg-ember-500" />
              Lobewise
            </Link>
            <nav aria-label="Main" className="flex flex-wrap items-center justify-end gap-x-3 gap-y-2 text-sm">
              <StaffHeaderNav />
            </nav>
          </div>
        </header>
        <main id="main" className="flex-1">
          {children}
        </main>
        <footer className="border-t border-steel-300 bg-paper-sunk text-sm text-ink-muted">
          <div className="mx-auto flex max-w-6xl flex-wrap justify-between gap-2 px-4 py-4">
            <span>{shopName ?? 'Shop details are unavailable right now'}</span>
            <span>Predictions are indicative; your shop’s dyno has the last word.</span>
          </div>
        </footer>
      </body>
    </html>
  );
}
