/** @type {import('next').NextConfig} */

// Headers for every response. Pages get their Content-Security-Policy from src/proxy.ts at request
// time (it names the payments host); the one here is the strict fallback for anything the proxy does
// not see (static files). HSTS is set by the TLS proxy in front of the app (README, Deployment).
const everyResponse = [
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
];

const notApi = [
  {
    key: 'Content-Security-Policy',
    value:
      "default-src 'self'; img-src 'self' data:; frame-ancestors 'none'; form-action 'self'; base-uri 'self'; object-src 'none'",
  },
];

// API answers are data, never pages, and hold private data: nothing may render or keep them.
const apiResponse = [
  { key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" },
  { key: 'Cache-Control', value: 'no-store' },
];

// Attachment downloads (/api/{cams,parts,labor}/<id>/attachments/<id>) set their own, stricter policy
// (a sandbox for an uploaded file shown inline) and cache rule; a header here would replace them.
const API_EXCEPT_DOWNLOADS = '/api/:path((?!(?:cams|parts|labor)/[^/]+/attachments/[^/]+/?$).*)';

const nextConfig = {
  poweredByHeader: false,
  // Database drivers load dialect modules dynamically, and pdfkit reads its own data files from disk;
  // keep them out of the bundle.
  serverExternalPackages: ['sequelize', 'mariadb', 'argon2', 'pdfkit'],
  async headers() {
    return [
      { source: '/:path*', headers: everyResponse },
      { source: '/:path((?!api/).*)', headers: notApi },
      { source: API_EXCEPT_DOWNLOADS, headers: apiResponse },
    ];
  },
};

export default nextConfig;
