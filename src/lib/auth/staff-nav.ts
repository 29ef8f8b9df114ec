import type { StaffRole } from './guard';

// The staff pages and who may open them: the header and the staff home show each person only
// their own. Add a page here when you add one (its page must still call requireRoleForPage).
export type StaffLink = { href: string; label: string; description: string; roles: readonly StaffRole[] };

export const STAFF_LINKS: readonly StaffLink[] = [
  { href: '/dashboard', label: 'Home', description: 'Where the working day starts.', roles: ['manager', 'counter', 'tech'] },
  { href: '/interviews/new', label: 'New interview', description: 'Sit with a customer and capture their whole combination.', roles: ['manager', 'counter'] },
  { href: '/interviews', label: 'Interviews', description: 'Recent builds from the counter: search, reopen, edit.', roles: ['manager', 'counter', 'tech'] },
  { href: '/advisor', label: 'Cam shortlist', description: 'Rank the shop’s cams for a customer’s build and see why.', roles: ['manager', 'counter', 'tech'] },
  { href: '/leads', label: 'Leads', description: 'Customers who answered the questionnaire at home: their answers, the shortlist they saw, follow-up.', roles: ['manager', 'counter'] },
  { href: '/quotes', label: 'Quotes', description: 'Drafts, sent quotes and deposits, with their state.', roles: ['manager', 'counter', 'tech'] },
  { href: '/jobs', label: 'Jobs', description: 'Accepted jobs: the build sheet, the parts and the dyno runs before and after.', roles: ['manager', 'tech'] },
  { href: '/catalogue', label: 'Catalogue', description: 'Cams, parts, labour operations and the rules that tie them together.', roles: ['manager', 'counter'] },
  { href: '/reports', label: 'Numbers', description: 'Quotes, conversion, deposits, refunds and margins for a date range.', roles: ['manager'] },
  { href: '/staff', label: 'Staff', description: 'Invite people, change roles, switch accounts off.', roles: ['manager'] },
  { href: '/account', label: 'Account', description: 'Your own password.', roles: ['manager', 'counter', 'tech'] },
];

export function linksFor(role: StaffRole): StaffLink[] {
  return STAFF_LINKS.filter((link) => link.roles.includes(role));
}

export const ROLE_NAMES: Record<StaffRole, string> = { manager: 'Manager', counter: 'Counter', tech: 'Technician' };
