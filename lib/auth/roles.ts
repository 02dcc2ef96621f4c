/**
 * Who may do what: the one permission table. Pure, so it is tested on its own; every page,
 * server action and route handler asks `can` (through lib/auth/session) before doing anything.
 * Scope (a keeper's own yards, a customer's own orders) is checked by the data functions.
 */
export const ROLES = ['owner', 'keeper', 'crew', 'customer'] as const;
export type Role = (typeof ROLES)[number];

const O = 'owner', K = 'keeper', C = 'crew', U = 'customer';

export const PERMISSIONS = {
  'backoffice.enter': [O, K, C],
  'settings.manage': [O],
  'staff.manage': [O],
  'audit.read': [O],
  'yards.manage': [O],
  'yards.read': [O, K, C],
  'colonies.read': [O, K, C],
  'colonies.write': [O, K],
  'supers.read': [O, K, C],
  'supers.write': [O, K],
  'supers.import': [O, K],
  'treatmentKinds.manage': [O],
  'superTags.print': [O],
  'lots.read': [O, K, C],
  'lots.write': [O, C],
  'lots.override': [O],
  'containerTypes.manage': [O],
  'products.manage': [O],
  'products.read': [O, K, C],
  'jarring.read': [O, K, C],
  'jarring.write': [O, C],
  'jarring.override': [O],
  'stock.read': [O, K, C],
  'stock.adjust': [O, C],
  'labels.print': [O, C],
  'labels.layouts': [O],
  'orders.desk': [O, C],
  'orders.refund': [O, C],
  'orders.own': [U],
  'reports.read': [O, K],
  'reports.send': [O],
  'trace.read': [O, C],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

/** The back-office menu each staff role sees. */
const MENU: { href: string; label: string; permission: Permission }[] = [
  { href: '/admin', label: 'Today', permission: 'backoffice.enter' },
  { href: '/admin/yards', label: 'Yards', permission: 'yards.read' },
  { href: '/admin/supers', label: 'Super pulls', permission: 'supers.read' },
  { href: '/admin/lots', label: 'Lots', permission: 'lots.read' },
  { href: '/admin/jarring', label: 'Jarring', permission: 'jarring.write' },
  { href: '/admin/stock', label: 'Stock', permission: 'stock.read' },
  { href: '/admin/orders', label: 'Orders', permission: 'orders.desk' },
  { href: '/admin/reports', label: 'Yield reports', permission: 'reports.read' },
  { href: '/admin/trace', label: 'Trace', permission: 'trace.read' },
  { href: '/admin/products', label: 'Products', permission: 'products.manage' },
  { href: '/admin/staff', label: 'Staff', permission: 'staff.manage' },
  { href: '/admin/settings', label: 'Settings', permission: 'settings.manage' },
];

export function menuFor(role: Role) {
  return MENU.filter((m) => can(role, m.permission));
}
