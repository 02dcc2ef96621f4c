import { authorize } from '@/lib/auth/session';
import { getSettings, updateSettings } from '@/lib/data/settings/settings';
import { settingsInput } from '@/lib/schemas/settings';
import { handleRouteError, readJson } from '@/lib/http/json';
import { assertSameOrigin } from '@/lib/http/origin';

export const dynamic = 'force-dynamic';

/** The business settings as JSON, for the owner only. */
export async function GET() {
  try {
    await authorize('settings.manage');
    return Response.json(await getSettings(), { headers: { 'Cache-Control': 'no-store' } });
  } catch (err) {
    return handleRouteError(err);
  }
}

/** Replaces the owner-editable settings; unknown fields are ignored. */
export async function PUT(req: Request) {
  try {
    await assertSameOrigin(req.headers);
    const user = await authorize('settings.manage');
    const data = settingsInput.parse(await readJson(req));
    await updateSettings(user.id, data);
    return Response.json(await getSettings());
  } catch (err) {
    return handleRouteError(err);
  }
}
