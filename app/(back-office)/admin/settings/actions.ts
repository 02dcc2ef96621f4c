'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { settingsInput } from '@/lib/schemas/settings';
import { updateSettings } from '@/lib/data/settings/settings';

export const saveSettingsAction = guardedAction('settings.manage', settingsInput, async (user, data) => {
  const { allowUntaggedSupers, ...rest } = data;
  await updateSettings(user.id, allowUntaggedSupers === undefined ? rest : { ...rest, allowUntaggedSupers });
  revalidatePath('/', 'layout');
  return { ok: true };
});
