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
// - expect: the status each caller must get. anonymous = no cookie; the rest are the demo users.
//   Customers hold no account: routes they reach by private link belong in their own tests.
import { DEMO, MISSING_ID } from '../support/demo';

export type Caller = 'anonymous' | 'manager' | 'counter' | 'tech';
export type AccessRow = {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  url?: string;
  body?: unknown;
  freshSession?: boolean;
  expect: Record<Caller, number>;
};

const publicRead = { anonymous: 200, manager: 200, counter: 200, tech: 200 };
const anyoneValidates = { anonymous: 422, manager: 422, counter: 422, tech: 422 };
const staffValidates = { anonymous: 401, manager: 422, counter: 422, tech: 422 };
const managerRead = { anonymous: 401, manager: 200, counter: 403, tech: 403 };
const managerValidates = { anonymous: 401, manager: 422, counter: 403, tech: 403 };

export const accessMatrix: AccessRow[] = [
  // Foundation
  { method: 'GET', path: '/api/health', expect: publicRead },

  // The advisor (issue 3): any signed-in staff member may rank; an empty body fails validation.
  { method: 'POST', path: '/api/advisor/rank', expect: staffValidates },
  { method: 'POST', path: '/api/advisor/model', expect: staffValidates },

  // Sign-in, roles and staff accounts (issue 4)
  { method: 'POST', path: '/api/auth/sign-in', expect: anyoneValidates },
  { method: 'POST', path: '/api/auth/sign-out', freshSession: true, expect: publicRead },
  { method: 'GET', path: '/api/auth/me', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/auth/forgot-password', expect: anyoneValidates },
  { method: 'POST', path: '/api/auth/reset-password', expect: anyoneValidates },
  { method: 'POST', path: '/api/account/password', expect: staffValidates },
  { method: 'GET', path: '/api/users', expect: managerRead },
  { method: 'POST', path: '/api/users', expect: managerValidates },
  { method: 'PATCH', path: '/api/users/[id]', url: `/api/users/${DEMO.users.manager}`, expect: managerValidates },
  // The manager's catalogue (issue 5). Staff read; only managers change anything. Writes that would
  // succeed use a body that fails validation (422), a multipart-only route answers 415 to JSON, and
  // DELETE rows name ids that do not exist (404), so no row changes the demo data.
  { method: 'GET', path: '/api/cams', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/cams', expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/cams/[id]', url: `/api/cams/${DEMO.cams.towBoss198}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/cams/[id]', url: `/api/cams/${DEMO.cams.towBoss198}`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'DELETE', path: '/api/cams/[id]', url: `/api/cams/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'POST', path: '/api/cams/import', expect: { anonymous: 401, manager: 415, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/cams/import/template', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'GET', path: '/api/cams/export', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'GET', path: '/api/cams/[id]/attachments', url: `/api/cams/${DEMO.cams.towBoss198}/attachments`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/cams/[id]/attachments', url: `/api/cams/${DEMO.cams.towBoss198}/attachments`, expect: { anonymous: 401, manager: 415, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/cams/[id]/attachments/[attachmentId]', url: `/api/cams/${DEMO.cams.towBoss198}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'DELETE', path: '/api/cams/[id]/attachments/[attachmentId]', url: `/api/cams/${DEMO.cams.towBoss198}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/parts', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/parts', expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/parts/[id]', url: `/api/parts/${DEMO.parts.springs570}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/parts/[id]', url: `/api/parts/${DEMO.parts.springs570}`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'DELETE', path: '/api/parts/[id]', url: `/api/parts/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/parts/[id]/attachments', url: `/api/parts/${DEMO.parts.springs570}/attachments`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/parts/[id]/attachments', url: `/api/parts/${DEMO.parts.springs570}/attachments`, expect: { anonymous: 401, manager: 415, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/parts/[id]/attachments/[attachmentId]', url: `/api/parts/${DEMO.parts.springs570}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'DELETE', path: '/api/parts/[id]/attachments/[attachmentId]', url: `/api/parts/${DEMO.parts.springs570}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/labor', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/labor', expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/labor/[id]', url: `/api/labor/${DEMO.labor.camSwapTruck}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/labor/[id]', url: `/api/labor/${DEMO.labor.camSwapTruck}`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  { method: 'DELETE', path: '/api/labor/[id]', url: `/api/labor/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/labor/[id]/attachments', url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/labor/[id]/attachments', url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments`, expect: { anonymous: 401, manager: 415, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/labor/[id]/attachments/[attachmentId]', url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'DELETE', path: '/api/labor/[id]/attachments/[attachmentId]', url: `/api/labor/${DEMO.labor.camSwapTruck}/attachments/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  { method: 'GET', path: '/api/settings', expect: managerRead },
  { method: 'PATCH', path: '/api/settings', expect: managerValidates },
  { method: 'GET', path: '/api/rules', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/rules', expect: managerValidates },
  { method: 'GET', path: '/api/rules/[id]', url: `/api/rules/${DEMO.needRules.install}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/rules/[id]', url: `/api/rules/${DEMO.needRules.install}`, expect: managerValidates },
  { method: 'DELETE', path: '/api/rules/[id]', url: `/api/rules/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 403 } },
  // The counter interview: customers and builds. Managers and counter staff write; technicians read.
  // Write rows send {} (fails validation: no version / no fields), so no row changes the demo data.
  { method: 'GET', path: '/api/customers', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/customers', expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/customers/[id]', url: `/api/customers/${DEMO.customers.whitlock}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/customers/[id]', url: `/api/customers/${DEMO.customers.whitlock}`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/builds', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/builds', expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/builds/[id]', url: `/api/builds/${DEMO.builds.whitlockTowingTruck}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/builds/[id]', url: `/api/builds/${DEMO.builds.whitlockTowingTruck}`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },

  // Quotes and the deposit (brief step 3). Staff read; managers and counter staff write; refunds are the
  // manager's. Writes that would succeed get a body that fails validation (422) or an id that does not
  // exist (404). The customer's link and the webhook need no account: an unknown token is 404 to
  // everyone, an unsigned webhook 400.
  { method: 'GET', path: '/api/quotes', expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/quotes', expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/quotes/[id]', url: `/api/quotes/${DEMO.quotes.whitlockSent}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'PATCH', path: '/api/quotes/[id]', url: `/api/quotes/${DEMO.quotes.vranesDraft}`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'POST', path: '/api/quotes/[id]/send', url: `/api/quotes/${MISSING_ID}/send`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 403 } },
  { method: 'POST', path: '/api/quotes/[id]/refund', url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/refund`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 403 } },
  // The quote lifecycle and documents (issue 12, items 2 and 6): an empty body fails validation; a PDF is a read.
  { method: 'POST', path: '/api/quotes/[id]/transition', url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/transition`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'POST', path: '/api/quotes/[id]/revise', url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/revise`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/quotes/[id]/pdf', url: `/api/quotes/${DEMO.quotes.whitlockSent}/pdf`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  // The balance and the payment documents (issue 12, items 6 and 7): an empty body fails validation; a
  // receipt or invoice of a quote or payment that does not exist is a 404 read for any staff member.
  { method: 'POST', path: '/api/quotes/[id]/payments', url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/payments`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'POST', path: '/api/quotes/[id]/balance-request', url: `/api/quotes/${DEMO.quotes.okaforDepositPaid}/balance-request`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'GET', path: '/api/quotes/[id]/payments/[paymentId]/receipt', url: `/api/quotes/${DEMO.quotes.whitlockSent}/payments/${MISSING_ID}/receipt`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'GET', path: '/api/quotes/[id]/invoice', url: `/api/quotes/${MISSING_ID}/invoice`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'POST', path: '/api/q/[token]/balance-checkout', url: '/api/q/not-a-live-link-0123456789abcdef/balance-checkout', expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 } },
  { method: 'GET', path: '/api/q/[token]/receipts/[paymentId]', url: '/api/q/not-a-live-link-0123456789abcdef/receipts/1', expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 } },
  { method: 'GET', path: '/api/q/[token]/invoice', url: '/api/q/not-a-live-link-0123456789abcdef/invoice', expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 } },
  // The manager's numbers: reads for managers only.
  { method: 'GET', path: '/api/reports/summary', expect: managerRead },
  { method: 'GET', path: '/api/reports/quotes.csv', expect: managerRead },
  { method: 'POST', path: '/api/q/[token]/checkout', url: '/api/q/not-a-live-link-0123456789abcdef/checkout', expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 } },
  { method: 'GET', path: '/api/q/[token]/pdf', url: '/api/q/not-a-live-link-0123456789abcdef/pdf', expect: { anonymous: 404, manager: 404, counter: 404, tech: 404 } },
  // The at-home questionnaire's leads: anyone may send answers (an empty body fails validation);
  // managers and counter staff read and move them. The PATCH names a lead that does not exist.
  { method: 'POST', path: '/api/leads', expect: anyoneValidates },
  { method: 'GET', path: '/api/leads', expect: { anonymous: 401, manager: 200, counter: 200, tech: 403 } },
  { method: 'PATCH', path: '/api/leads/[id]', url: `/api/leads/${MISSING_ID}`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
  { method: 'POST', path: '/api/payments/webhook', expect: { anonymous: 400, manager: 400, counter: 400, tech: 400 } },
  // Dyno runs (the brief's step 6). All staff read; technicians and managers record and delete. The
  // POST body fails validation and the id rows name a run that does not exist, so nothing changes.
  { method: 'GET', path: '/api/dyno-runs', url: `/api/dyno-runs?buildId=${DEMO.builds.okaforStreetTruck}`, expect: { anonymous: 401, manager: 200, counter: 200, tech: 200 } },
  { method: 'POST', path: '/api/dyno-runs', expect: { anonymous: 401, manager: 422, counter: 403, tech: 422 } },
  { method: 'GET', path: '/api/dyno-runs/[id]', url: `/api/dyno-runs/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 404, tech: 404 } },
  { method: 'DELETE', path: '/api/dyno-runs/[id]', url: `/api/dyno-runs/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 404 } },
  // The job board and the sign-off (issue 9, items 2 and 3): technicians and managers only. The id rows
  // name a quote that does not exist; empty bodies fail validation before anything is looked up.
  { method: 'GET', path: '/api/jobs', expect: { anonymous: 401, manager: 200, counter: 403, tech: 200 } },
  { method: 'GET', path: '/api/jobs/[id]', url: `/api/jobs/${MISSING_ID}`, expect: { anonymous: 401, manager: 404, counter: 403, tech: 404 } },
  { method: 'PATCH', path: '/api/jobs/[id]', url: `/api/jobs/${MISSING_ID}`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 422 } },
  { method: 'POST', path: '/api/jobs/[id]/sign-off', url: `/api/jobs/${MISSING_ID}/sign-off`, expect: { anonymous: 401, manager: 422, counter: 403, tech: 422 } },
  // A lead's note log (issue 9, item 4): managers and counter staff; an empty body fails validation.
  { method: 'POST', path: '/api/leads/[id]/notes', url: `/api/leads/${MISSING_ID}/notes`, expect: { anonymous: 401, manager: 422, counter: 422, tech: 403 } },
];
