// Roles and permissions as typed strings. The server checks them in services; the UI uses them
// only to hide controls it would refuse anyway.
export const SELF_CHOSEN_ROLES = ['songwriter', 'drummer', 'engineer'] as const;
export const ROLES = [...SELF_CHOSEN_ROLES, 'admin'] as const;
export type SelfChosenRole = (typeof SELF_CHOSEN_ROLES)[number];
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  songwriter: 'Songwriter',
  drummer: 'Drummer',
  engineer: 'Engineer',
  admin: 'Admin',
};

export const PERMISSIONS = {
  'read:account:own': ['songwriter', 'drummer', 'engineer', 'admin'],
  'update:account:own': ['songwriter', 'drummer', 'engineer', 'admin'],
  'create:brief:own': ['songwriter'],
  'update:brief:own': ['songwriter'],
  'read:brief:open': ['drummer', 'admin'],
  'update:drummer-profile:own': ['drummer'],
  'create:quote:own': ['drummer'],
  'update:engineer-profile:own': ['engineer'],
  'create:room:own': ['engineer'],
  'update:room:own': ['engineer'],
  'create:delivery:own': ['drummer', 'engineer'],
  'pay:booking:own': ['songwriter'],
  'accept:delivery:own': ['songwriter'],
  'open:dispute:own': ['songwriter', 'drummer', 'engineer'],
  'read:booking:any': ['admin'],
  'release:booking:any': ['admin'],
  'refund:booking:any': ['admin'],
  'settle:dispute:any': ['admin'],
  'disable:account:any': ['admin'],
  'read:ledger:any': ['admin'],
  'read:audit:any': ['admin'],
  'grant:admin:any': ['admin'],
  'review:booking:own': ['songwriter'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(roles: readonly string[], permission: Permission): boolean {
  const allowed: readonly string[] = PERMISSIONS[permission];
  return roles.some((r) => allowed.includes(r));
}

export function isRole(value: string): value is Role {
  return (ROLES as readonly string[]).includes(value);
}
