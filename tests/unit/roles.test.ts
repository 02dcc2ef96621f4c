import { describe, expect, it } from 'vitest';
import { can, GRANTS, menuFor, PERMISSIONS, ROLES, isRole } from '@/lib/auth/roles';

describe('permission table', () => {
  it('grants each permission once (a second grant would silently replace the first)', () => {
    const granted = GRANTS.flatMap((g) => g.permissions);
    expect(new Set(granted).size).toBe(granted.length);
    expect(Object.keys(PERMISSIONS).sort()).toEqual([...granted].sort());
  });

  it('gives customers no back-office permission at all', () => {
    const staffOnly = Object.keys(PERMISSIONS).filter((p) => p !== 'orders.own') as (keyof typeof PERMISSIONS)[];
    for (const p of staffOnly) expect(can('customer', p), p).toBe(false);
    expect(can('customer', 'orders.own')).toBe(true);
  });

  it('keeps owner-only powers with the owner', () => {
    for (const p of [
      'settings.manage',
      'staff.manage',
      'lots.override',
      'jarring.override',
      'reports.send',
      'products.manage',
    ] as const) {
      expect(can('owner', p)).toBe(true);
      expect(can('keeper', p)).toBe(false);
      expect(can('crew', p)).toBe(false);
    }
  });

  it('lets keepers write colony records but not lots; crew the reverse', () => {
    expect(can('keeper', 'colonies.write')).toBe(true);
    expect(can('keeper', 'lots.write')).toBe(false);
    expect(can('crew', 'colonies.write')).toBe(false);
    expect(can('crew', 'supers.read')).toBe(true);
    expect(can('crew', 'lots.write')).toBe(true);
  });

  it('refuses a missing or unknown role', () => {
    expect(can(null, 'backoffice.enter')).toBe(false);
    expect(can(undefined, 'lots.read')).toBe(false);
    expect(isRole('admin')).toBe(false);
    expect(ROLES.every(isRole)).toBe(true);
  });

  it('shows each staff role only its own menu', () => {
    const owner = menuFor('owner').map((m) => m.href);
    const keeper = menuFor('keeper').map((m) => m.href);
    const crew = menuFor('crew').map((m) => m.href);
    expect(owner).toContain('/admin/settings');
    expect(keeper).not.toContain('/admin/settings');
    expect(keeper).toContain('/admin/yards');
    expect(crew).toContain('/admin/lots');
    expect(crew).not.toContain('/admin/staff');
    expect(menuFor('customer')).toEqual([]);
  });
});
