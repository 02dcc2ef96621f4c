'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { staffInput, staffUpdateInput } from '@/lib/schemas/staff';
import { createStaff, EmailTakenError, updateStaff } from '@/lib/data/staff/users';
import { fail } from '@/lib/schemas/result';

export const createStaffAction = guardedAction('staff.manage', staffInput, async (user, data) => {
  try {
    await createStaff(user.id, data);
  } catch (err) {
    if (err instanceof EmailTakenError) return fail(err.message, { email: err.message });
    throw err;
  }
  revalidatePath('/admin/staff');
  return { ok: true };
});

export const updateStaffAction = guardedAction('staff.manage', staffUpdateInput, async (user, data) => {
  if (data.userId === user.id && (data.disabled || (data.role && data.role !== 'owner'))) {
    return fail('You cannot disable your own account or give up your own owner role.');
  }
  const row = await updateStaff(user.id, data.userId, { role: data.role, disabled: data.disabled });
  if (!row) return fail('No staff member with that id.');
  revalidatePath('/admin/staff');
  return { ok: true };
});
