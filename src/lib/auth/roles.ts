// Staff roles, in a module with no imports so the proxy, the navigation and the policy table can share it.
export type StaffRole = 'manager' | 'counter' | 'tech';

export const ALL_STAFF: readonly StaffRole[] = ['manager', 'counter', 'tech'];

export type SessionUser = { id: number; email: string; name: string; role: StaffRole };
