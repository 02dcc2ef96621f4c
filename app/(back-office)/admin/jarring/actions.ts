'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { jarringRunInput, overrideRunInput } from '@/lib/schemas/jarring';
import { createJarringRun, MavNeededError, overrideJarringRun, type RunResult } from '@/lib/data/jarring/runs';
import { fail } from '@/lib/schemas/result';

export const createJarringRunAction = guardedAction<typeof jarringRunInput, RunResult>(
  'jarring.write',
  jarringRunInput,
  async (user, data) => {
    try {
      const result = await createJarringRun(user, data);
      revalidatePath('/admin/jarring');
      revalidatePath('/admin/stock');
      return { ok: true, data: result };
    } catch (err) {
      if (err instanceof MavNeededError) return fail(err.message, { mavGrams: err.message });
      throw err;
    }
  },
);

export const overrideJarringRunAction = guardedAction('jarring.override', overrideRunInput, async (user, data) => {
  await overrideJarringRun(user, data.runId, data.reason);
  revalidatePath('/admin/jarring');
  revalidatePath(`/admin/jarring/${data.runId}`);
  revalidatePath('/admin/stock');
  return { ok: true };
});
