import localFont from 'next/font/local';

// Fonts ship in the repo (SIL OFL, see LICENSE-*.txt) so builds never reach the network.
export const bodyFont = localFont({
  src: [
    { path: './fonts/inter-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/inter-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: './fonts/inter-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-body',
  display: 'swap',
  // Not preloaded either: text paints at once in the metric-matched fallback and swaps when a file lands. Three
  // preloaded files (73 kB) were fetched before the customer's page first painted, and Lighthouse's mobile
  // profile counts every byte fetched before the largest paint against it (the quote page lost 2–5 points).
  preload: false,
});

export const specFont = localFont({
  src: [
    { path: './fonts/jetbrains-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/jetbrains-mono-latin-600-normal.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-spec',
  display: 'swap',
  // Figures in mono are staff screens' business; the customer's pages (Lighthouse's mobile profile counts every
  // preloaded byte before the largest paint) fetch these two files only when a page actually uses them.
  preload: false,
});
