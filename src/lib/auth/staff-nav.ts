import { roleCan, type Permission } from './policy';
import type { StaffRole } from './roles';

// The staff pages, each with the permission its page checks (requireAccessForPage): the header and
// the staff home show each person only the pages they may open, and the proxy's first gate
// (src/proxy.ts) takes its staff prefixes from these links. Add a page here when you add one.
// Imports only policy.ts and roles.ts, so the proxy can use it without pulling in server code.
export type StaffLink = { href: string; label: string; description: string; permission: Permission };

export const STAFF_LINKS: readonly StaffLink[] = [
  { href: '/dashboard', label: 'Home', description: 'Where the working day starts.', permission: 'staff-area.open' },
  {
    href: '/interviews/new',
    label: 'New interview',
    description: 'Sit with a customer and capture their whole combination.',
    permission: 'builds.write',
  },
  {
    href: '/interviews',
    label: 'Interviews',
    description: 'Recent builds from the counter: search, reopen, edit.',
    permission: 'builds.read',
  },
  {
    href: '/advisor',
    label: 'Cam shortlist',
    description: 'Rank the shop’s cams for a customer’s build and see why.',
    permission: 'advisor.use',
  },
  {
    href: '/leads',
    label: 'Leads',
    description: 'Customers who answered the questionnaire at home: their answers, the shortlist they saw, follow-up.',
    permission: 'leads.follow-up',
  },
  {
    href: '/quotes',
    label: 'Quotes',
    description: 'Drafts, sent quotes and deposits, with their state.',
    permission: 'quotes.read',
  },
  {
    href: '/jobs',
    label: 'Jobs',
    description: 'Accepted jobs: the build sheet, the parts and the dyno runs before and after.',
    permission: 'jobs.read',
  },
  {
    href: '/catalogue',
    label: 'Catalogue',
    description: 'Cams, parts, labour operations and the rules that tie them together.',
    permission: 'catalogue.read',
  },
  {
    href: '/reports',
    label: 'Numbers',
    description: 'Quotes, conversion, deposits, refunds and margins for a date range.',
    permission: 'reports.read',
  },
  {
    href: '/staff',
    label: 'Staff',
    description: 'Invite people, change roles, switch accounts off.',
    permission: 'staff.manage',
  },
  { href: '/account', label: 'Account', description: 'Your own password.', permission: 'account.self' },
];

export function linksFor(role: StaffRole): StaffLink[] {
  return STAFF_LINKS.filter((link) => roleCan(role, link.permission));
}

/** The first path segment of every staff link ('/interviews/new' → '/interviews'), once each. */
export const STAFF_PREFIXES: readonly string[] = [...new Set(STAFF_LINKS.map((link) => `/${link.href.split('/')[1]}`))];

export const ROLE_NAMES: Record<StaffRole, string> = { manager: 'Manager', counter: 'Counter', tech: 'Technician' };
