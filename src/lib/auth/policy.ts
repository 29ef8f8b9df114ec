import type { StaffRole } from './roles';

// The one permission table. Route handlers name a permission (`route({ permission })`), pages call
// `requireAccessForPage(permission)`, the staff navigation, the proxy's first gate, cost hiding and the
// access-matrix test all read this table. Adding a route means picking (or adding) one row here.
export const POLICY = {
  'account.self': ['manager', 'counter', 'tech'],
  'advisor.use': ['manager', 'counter', 'tech'],
  'builds.read': ['manager', 'counter', 'tech'],
  'builds.write': ['manager', 'counter'],
  'catalogue.read': ['manager', 'counter', 'tech'],
  'catalogue.write': ['manager'],
  'costs.read': ['manager', 'counter'],
  'customers.read': ['manager', 'counter', 'tech'],
  'customers.write': ['manager', 'counter'],
  'dyno.read': ['manager', 'counter', 'tech'],
  'dyno.record': ['manager', 'tech'],
  'jobs.read': ['manager', 'tech'],
  'jobs.record': ['manager', 'tech'],
  'leads.follow-up': ['manager', 'counter'],
  'quotes.read': ['manager', 'counter', 'tech'],
  'quotes.write': ['manager', 'counter'],
  // A counter discount above the shop's limit waits for a manager's approval before the quote can be sent.
  'quotes.approve-discount': ['manager'],
  'quotes.send': ['manager', 'counter'],
  'quotes.take-payment': ['manager', 'counter'],
  'quotes.refund': ['manager'],
  'reports.read': ['manager'],
  'settings.manage': ['manager'],
  // Signed in as staff at all: the staff layout and the staff home. Each page narrows it with its own row.
  'staff-area.open': ['manager', 'counter', 'tech'],
  'staff.manage': ['manager'],
} as const satisfies Record<string, readonly StaffRole[]>;

export type Permission = keyof typeof POLICY;

export function rolesWith(permission: Permission): readonly StaffRole[] {
  return POLICY[permission];
}

export function roleCan(role: StaffRole, permission: Permission): boolean {
  return (POLICY[permission] as readonly StaffRole[]).includes(role);
}

export function can(user: { role: StaffRole } | null | undefined, permission: Permission): boolean {
  return !!user && roleCan(user.role, permission);
}
