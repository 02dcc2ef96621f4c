import { requirePermission } from '@/lib/auth/session';
import { listBlendableLots } from '@/lib/data/lots/blends';
import { getSettings } from '@/lib/data/settings/settings';
import { formatWeight } from '@/lib/domain/units';
import { PageHeader } from '@/components/ui/page-header';
import { BlendForm } from '@/components/lots/blend-form';
import { createBlendAction } from '../actions';

export const metadata = { title: 'New blend' };

export default async function BlendPage() {
  await requirePermission('lots.write', '/admin/lots/blend');
  const [lots, settings] = await Promise.all([listBlendableLots(), getSettings()]);
  return (
    <>
      <PageHeader
        title="New blend"
        lead="A new lot made from parts of released lots. The parents stay linked; its water content is the weight-weighted mean of theirs."
      />
      <BlendForm
        unit={settings.weightSystem === 'us' ? 'lb' : 'kg'}
        lots={lots.map((l) => ({
          id: l.id,
          code: l.code,
          floralSource: l.floralSource,
          remaining: formatWeight(l.remainingGrams, settings.weightSystem),
        }))}
        onCreate={createBlendAction}
      />
    </>
  );
}
