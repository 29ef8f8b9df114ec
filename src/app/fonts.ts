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
  // Preloaded (unlike the mono font below): without it the swap from the fallback moved the customer's quote page
  // (Lighthouse measured layout shifts of 0.05–0.09, about 3 points), more than the 73 kB cost its largest paint.
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
