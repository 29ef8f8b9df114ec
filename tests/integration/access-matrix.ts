// Who gets what from every route handler. One row per (method, route) that exists under
// src/app/api; access-matrix.test.ts fails when a route or method has no row here, or a row names
// a route that no longer exists. Add your rows when you add a route.
//
// - path: the route as its folder spells it (dynamic segments in brackets, route groups left out),
//   e.g. '/api/users/[id]'.
// - url: the concrete address to call when path has dynamic segments (defaults to path).
// - body: sent as JSON for non-GET methods (defaults to {}). Pick a body that cannot change
//   anything when the role is let in, so that an allowed role answers with a validation error
//   (422) or a read (200), and the rows can run in any order against the shared demo data.
// - freshSession: sign the roles in anew for this row (for rows that end the session).
// - permission + allowed: for a route whose answer follows from the permission table
//   (src/lib/auth/policy.ts). Signed out gets 401, each role the row names gets `allowed` (the answer the
//   route gives someone who is let in: 200 for a read, 422 for an empty body, 404 for an id that does not
//   exist, 415 for JSON sent to a multipart route), every other role 403. The expectation follows POLICY, so
//   a handler that checks a different permission than its row names fails here.
// - expect: the status each caller must get, spelled out, for public routes and special cases.
//   anonymous = no cookie; the rest are the demo users. Customers hold no account: routes they reach by
//   private link belong in their own tests.
import { POLICY, type Permission } from '../../src/lib/auth/policy';
import { DEMO, MISSING_ID } from '../support/demo';

export type Caller = 'anonymous' | 'manager' | 'counter' | 'tech';
type RowBase = {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  url?: string;
  body?: unknown;
  freshSession?: boolean;
};
export type AccessRow = RowBase & ({ permission: Permission; allowed: number } | { expect: Record<Caller, number> });

/** The status each caller must get: from the permission table for a permission row, else as written. */
export function expectedFor(row: AccessRow): Record<Caller, number> {
  if ('expect' in row) return row.expect;
  const roles: readonly string[] = POLICY[row.permission];
  const answer = (role: Exclude<Caller, 'anonymous'>) => (roles.includes(role) ? row.allowed : 403);
  return { anonymous: 401, manager: answer('manager'), counter: answer('counter'), tech: answer('tech') };
}

const publicRead = { anonymous: 200, manager: 200, counter: 200, tech: 200 };
const anyoneValidates = { anonymous: 422, manager: 422, counter: 422, tech: 422 };

export const accessMatrix: AccessRow[] = [
  // Foundation
  { method: 'GET', path: '/api/health', expect: publicRead },

  // The advisor (issue 3): any signed-in staff member may rank; an empty body fails validation.
  { method: 'POST', path: '/api/advisor/rank', permission: 'advisor.use', allowed: 422 },
  { method: 'POST', path: '/api/advisor/model', permission: 'advisor.use', allowed: 422 },

  // Sign-in, roles and staff accounts (issue 4)
  { method: 'POST', path: '/api/auth/sign-in', expect: anyoneValidates },
  { method: 'POST', path: '/api/auth/sign-out', freshSession: true, expect: publicRead },
  { method: 'GET', path: '/api/auth/me', permission: 'account.self', allowed: 200 },
  { method: 'POST', path: '/api/auth/forgot-password', expect: anyoneValidates },
  { method: 'POST', path: '/api/auth/reset-password', expect: anyoneValidates },
  { method: 'POST', path: '/api/account/password', permission: 'account.self', allowed: 422 },
  { method: 'GET', path: '/api/users', permission: 'staff.manage', allowed: 200 },
  { method: 'POST', path: '/api/users', permission: 'staff.manage', allowed: 422 },
  {
    method: 'PATCH',
    path: '/api/users/[id]',
    url: `/api/users/${DEMO.users.manager}`,
    permission: 'staff.manage',
    allowed: 422,
  },
  // The manager's catalogue (issue 5). Staff read; only managers change anything. Writes that would
  // succeed use a body that fails validation (422), a multipart-only route answers 415 to JSON, and
  // DELETE rows name ids that do not exist (404), so no row changes the demo data.
  { method: 'GET', path: '/api/cams', permission: 'catalogue.read', allowed: 200 },
  { method: 'POST', path: '/api/cams', permission: 'catalogue.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/cams/[id]',
    url: `/api/cams/${DEMO.cams.towBoss198}`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/cams/[id]',
    url: `/api/cams/${DEMO.cams.towBoss198}`,
    permission: 'catalogue.write',
    allowed: 422,
  },
  {
    method: 'DELETE',
    path: '/api/cams/[id]',
    url: `/api/cams/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  { method: 'POST', path: '/api/cams/import', permission: 'catalogue.write', allowed: 415 },
  { method: 'GET', path: '/api/cams/import/template', permission: 'catalogue.read', allowed: 200 },
  { method: 'GET', path: '/api/cams/export', permission: 'catalogue.read', allowed: 200 },
  {
    method: 'GET',
    path: '/api/cams/[id]/attachments',
    url: `/api/cams/${DEMO.cams.towBoss198}/attachments`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'POST',
    path: '/api/cams/[id]/attachments',
    url: `/api/cams/${DEMO.cams.towBoss198}/attachments`,
    permission: 'catalogue.write',
    allowed: 415,
  },
  {
    method: 'GET',
    path: '/api/cams/[id]/attachments/[attachmentId]',
    url: `/api/cams/${DEMO.cams.towBoss198}/attachments/${MISSING_ID}`,
    permission: 'catalogue.read',
    allowed: 404,
  },
  {
    method: 'DELETE',
    path: '/api/cams/[id]/attachments/[attachmentId]',
    url: `/api/cams/${DEMO.cams.towBoss198}/attachments/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  { method: 'GET', path: '/api/parts', permission: 'catalogue.read', allowed: 200 },
  { method: 'POST', path: '/api/parts', permission: 'catalogue.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/parts/[id]',
    url: `/api/parts/${DEMO.parts.springs570}`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/parts/[id]',
    url: `/api/parts/${DEMO.parts.springs570}`,
    permission: 'catalogue.write',
    allowed: 422,
  },
  {
    method: 'DELETE',
    path: '/api/parts/[id]',
    url: `/api/parts/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  {
    method: 'GET',
    path: '/api/parts/[id]/attachments',
    url: `/api/parts/${DEMO.parts.springs570}/attachments`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'POST',
    path: '/api/parts/[id]/attachments',
    url: `/api/parts/${DEMO.parts.springs570}/attachments`,
    permission: 'catalogue.write',
    allowed: 415,
  },
  {
    method: 'GET',
    path: '/api/parts/[id]/attachments/[attachmentId]',
    url: `/api/parts/${DEMO.parts.springs570}/attachments/${MISSING_ID}`,
    permission: 'catalogue.read',
    allowed: 404,
  },
  {
    method: 'DELETE',
    path: '/api/parts/[id]/attachments/[attachmentId]',
    url: `/api/parts/${DEMO.parts.springs570}/attachments/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  { method: 'GET', path: '/api/labor', permission: 'catalogue.read', allowed: 200 },
  { method: 'POST', path: '/api/labor', permission: 'catalogue.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/labor/[id]',
    url: `/api/labor/${DEMO.labor.camSwapTruck}`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/labor/[id]',
    url: `/api/labor/${DEMO.labor.camSwapTruck}`,
    permission: 'catalogue.write',
    allowed: 422,
  },
  {
    method: 'DELETE',
    path: '/api/labor/[id]',
    url: `/api/labor/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  {
    method: 'GET',
    path: '/api/labor/[id]/attachments',
    url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'POST',
    path: '/api/labor/[id]/attachments',
    url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments`,
    permission: 'catalogue.write',
    allowed: 415,
  },
  {
    method: 'GET',
    path: '/api/labor/[id]/attachments/[attachmentId]',
    url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments/${MISSING_ID}`,
    permission: 'catalogue.read',
    allowed: 404,
  },
  {
    method: 'DELETE',
    path: '/api/labor/[id]/attachments/[attachmentId]',
    url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  { method: 'GET', path: '/api/settings', permission: 'settings.manage', allowed: 200 },
  { method: 'PATCH', path: '/api/settings', permission: 'settings.manage', allowed: 422 },
  { method: 'GET', path: '/api/rules', permission: 'catalogue.read', allowed: 200 },
  { method: 'POST', path: '/api/rules', permission: 'catalogue.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/rules/[id]',
    url: `/api/rules/${DEMO.needRules.install}`,
    permission: 'catalogue.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/rules/[id]',
    url: `/api/rules/${DEMO.needRules.install}`,
    permission: 'catalogue.write',
    allowed: 422,
  },
  {
    method: 'DELETE',
    path: '/api/rules/[id]',
    url: `/api/rules/${MISSING_ID}`,
    permission: 'catalogue.write',
    allowed: 404,
  },
  // The counter interview: customers and builds. Managers and counter staff write; technicians read.
  // Write rows send {} (fails validation: no version / no fields), so no row changes the demo data.
  { method: 'GET', path: '/api/customers', permission: 'customers.read', allowed: 200 },
  { method: 'POST', path: '/api/customers', permission: 'customers.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/customers/[id]',
    url: `/api/customers/${DEMO.customers.whitlock}`,
    permission: 'customers.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/customers/[id]',
    url: `/api/customers/${DEMO.customers.whitlock}`,
    permission: 'customers.write',
    allowed: 422,
  },
  { method: 'GET', path: '/api/builds', permission: 'builds.read', allowed: 200 },
  { method: 'POST', path: '/api/builds', permission: 'builds.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/builds/[id]',
    url: `/api/builds/${DEMO.builds.whitlockTowingTruck}`,
    permission: 'builds.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/builds/[id]',
    url: `/api/builds/${DEMO.builds.whitlockTowingTruck}`,
    permission: 'builds.write',
    allowed: 422,
  },

  // Quotes and the deposit (brief step 3). Staff read; managers and counter staff write; refunds are the
  // manager's. Writes that would succeed get a body that fails validation (422) or an id that does not
  // exist (404). The customer's link and the webhook need no account: an unknown token is 404 to
  // everyone, an unsigned webhook 400.
  { method: 'GET', path: '/api/quotes', permission: 'quotes.read', allowed: 200 },
  { method: 'POST', path: '/api/quotes', permission: 'quotes.write', allowed: 422 },
  {
    method: 'GET',
    path: '/api/quotes/[id]',
    url: `/api/quotes/${DEMO.quotes.whitlockSent}`,
    permission: 'quotes.read',
    allowed: 200,
  },
  {
    method: 'PATCH',
    path: '/api/quotes/[id]',
    url: `/api/quotes/${DEMO.quotes.vranesDraft}`,
    permission: 'quotes.write',
    allowed: 422,
  },
  {
    method: 'POST',
    path: '/api/quotes/[id]/send',
    url: `/api/quotes/${MISSING_ID}/send`,
    permission: 'quotes.send',
    allowed: 404,
  },
  {
    method: 'POST',
    path: '/api/quotes/[id]/refund',
    url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/refund`,
    permission: 'quotes.refund',
    allowed: 422,
  },
  // The quote lifecycle and documents (issue 12, items 2 and 6): an empty body fails validation; a PDF is a read.
  {
    method: 'POST',
    path: '/api/quotes/[id]/transition',
    url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/transition`,
    permission: 'quotes.write',
    allowed: 422,
  },
  {
    method: 'POST',
    path: '/api/quotes/[id]/revise',
    url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/revise`,
    permission: 'quotes.write',
    allowed: 422,
  },
  // A counter discount above the shop's limit: only a manager approves it (an empty body names the version).
  {
    method: 'POST',
    path: '/api/quotes/[id]/approve-discount',
    url: `/api/quotes/${DEMO.quotes.vranesDraft}/approve-discount`,
    permission: 'quotes.approve-discount',
    allowed: 422,
  },
  {
    method: 'GET',
    path: '/api/quotes/[id]/pdf',
    url: `/api/quotes/${DEMO.quotes.whitlockSent}/pdf`,
    permission: 'quotes.read',
    allowed: 200,
  },
  // The balance and the payment documents (issue 12, items 6 and 7): an empty body fails validation; a
  // receipt or invoice of a quote or payment that does not exist is a 404 read for any staff member.
  {
    method: 'POST',
    path: '/api/quotes/[id]/payments',
    url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/payments`,
    permission: 'quotes.take-payment',
    allowed: 422,
  },
  {
    method: 'POST',
    path: '/api/quotes/[id]/balance-request',
    url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/balance-request`,
    permission: 'quotes.take-payment',
    allowed: 422,
  },
  {
    method: 'GET',
    path: '/api/quotes/[id]/payments/[paymentId]/receipt',
    url: `/api/quotes/${DEMO.quotes.whitlockSent}/payments/${MISSING_ID}/receipt`,
    permission: 'quotes.read',
    allowed: 404,
  },
  {
    method: 'GET',
    path: '/api/quotes/[id]/invoice',
    url: `/api/quotes/${MISSING_ID}/invoice`,
    permission: 'quotes.read',
    allowed: 404,
  },
  {
    method: 'POST',
    path: '/api/q/[token]/balance-checkout',
    url: '/api/q/not-a-live-link-0123456789abcdef/balance-checkout',
    expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 },
  },
  {
    method: 'GET',
    path: '/api/q/[token]/receipts/[paymentId]',
    url: '/api/q/not-a-live-link-0123456789abcdef/receipts/1',
    expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 },
  },
  {
    method: 'GET',
    path: '/api/q/[token]/invoice',
    url: '/api/q/not-a-live-link-0123456789abcdef/invoice',
    expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 },
  },
  // The manager's numbers: reads for managers only.
  { method: 'GET', path: '/api/reports/summary', permission: 'reports.read', allowed: 200 },
  { method: 'GET', path: '/api/reports/quotes.csv', permission: 'reports.read', allowed: 200 },
  {
    method: 'POST',
    path: '/api/q/[token]/checkout',
    url: '/api/q/not-a-live-link-0123456789abcdef/checkout',
    expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 },
  },
  {
    method: 'GET',
    path: '/api/q/[token]/pdf',
    url: '/api/q/not-a-live-link-0123456789abcdef/pdf',
    expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 },
  },
  // The at-home questionnaire's leads: anyone may send answers (an empty body fails validation);
  // managers and counter staff read and move them. The PATCH names a lead that does not exist.
  { method: 'POST', path: '/api/leads', expect: anyoneValidates },
  { method: 'GET', path: '/api/leads', permission: 'leads.follow-up', allowed: 200 },
  {
    method: 'PATCH',
    path: '/api/leads/[id]',
    url: `/api/leads/${MISSING_ID}`,
    permission: 'leads.follow-up',
    allowed: 422,
  },
  { method: 'POST', path: '/api/payments/webhook', expect: { anonymous: 400, manager: 400, counter: 400, tech: 400 } },
  // Dyno runs (the brief's step 6). All staff read; technicians and managers record and delete. The
  // POST body fails validation and the id rows name a run that does not exist, so nothing changes.
  {
    method: 'GET',
    path: '/api/dyno-runs',
    url: `/api/dyno-runs?buildId=${DEMO.builds.okaforStreetTruck}`,
    permission: 'dyno.read',
    allowed: 200,
  },
  { method: 'POST', path: '/api/dyno-runs', permission: 'dyno.record', allowed: 422 },
  // The pull-CSV check is multipart only: JSON gets 415 from whoever is let in.
  { method: 'POST', path: '/api/dyno-runs/pull-csv', permission: 'dyno.record', allowed: 415 },
  {
    method: 'GET',
    path: '/api/dyno-runs/[id]',
    url: `/api/dyno-runs/${MISSING_ID}`,
    permission: 'dyno.read',
    allowed: 404,
  },
  {
    method: 'DELETE',
    path: '/api/dyno-runs/[id]',
    url: `/api/dyno-runs/${MISSING_ID}`,
    permission: 'dyno.record',
    allowed: 404,
  },
  // The job board and the sign-off (issue 9, items 2 and 3): technicians and managers only. The id rows
  // name a quote that does not exist; empty bodies fail validation before anything is looked up.
  { method: 'GET', path: '/api/jobs', permission: 'jobs.read', allowed: 200 },
  { method: 'GET', path: '/api/jobs/[id]', url: `/api/jobs/${MISSING_ID}`, permission: 'jobs.read', allowed: 404 },
  { method: 'PATCH', path: '/api/jobs/[id]', url: `/api/jobs/${MISSING_ID}`, permission: 'jobs.record', allowed: 422 },
  {
    method: 'POST',
    path: '/api/jobs/[id]/sign-off',
    url: `/api/jobs/${MISSING_ID}/sign-off`,
    permission: 'jobs.record',
    allowed: 422,
  },
  // A lead's note log (issue 9, item 4): managers and counter staff; an empty body fails validation.
  {
    method: 'POST',
    path: '/api/leads/[id]/notes',
    url: `/api/leads/${MISSING_ID}/notes`,
    permission: 'leads.follow-up',
    allowed: 422,
  },
];
