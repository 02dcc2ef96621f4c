/**
 * Who may do what: the one permission table. Pure, so it is tested on its own; every page,
 * server action and route handler asks `can` (through lib/auth/session) before doing anything.
 * Scope (a keeper's own yards, a customer's own orders) is checked by the data functions.
 */
export const ROLES = ['owner', 'keeper', 'crew', 'customer'] as const;
export type Role = (typeof ROLES)[number];

const O = 'owner',
  K = 'keeper',
  C = 'crew',
  U = 'customer';

/** Each permission once, under the roles that hold it. */
export const GRANTS = [
  {
    roles: [O, K, C],
    permissions: [
      'backoffice.enter',
      'yards.read',
      'colonies.read',
      'supers.read',
      'lots.read',
      'products.read',
      'jarring.read',
      'stock.read',
    ],
  },
  { roles: [O, K], permissions: ['colonies.write', 'supers.write', 'supers.import', 'reports.read'] },
  {
    roles: [O, C],
    permissions: [
      'lots.write',
      'jarring.write',
      'stock.adjust',
      'labels.print',
      'orders.desk',
      'orders.refund',
      'trace.read',
    ],
  },
  {
    roles: [O],
    permissions: [
      'settings.manage',
      'staff.manage',
      'audit.read',
      'yards.manage',
      'treatmentKinds.manage',
      'superTags.print',
      'lots.override',
      'containerTypes.manage',
      'products.manage',
      'jarring.override',
      'labels.layouts',
      'reports.send',
    ],
  },
  { roles: [U], permissions: ['orders.own'] },
] as const satisfies readonly { roles: readonly Role[]; permissions: readonly string[] }[];

export type Permission = (typeof GRANTS)[number]['permissions'][number];

/** The roles that hold each permission. */
export const PERMISSIONS: Readonly<Record<Permission, readonly Role[]>> = (() => {
  const table = {} as Record<Permission, readonly Role[]>;
  for (const { roles, permissions } of GRANTS) for (const p of permissions) table[p] = roles;
  return table;
})();

export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return PERMISSIONS[permission].includes(role);
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
