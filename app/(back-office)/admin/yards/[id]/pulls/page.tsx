import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { getYard } from '@/lib/data/yards/yards';
import { listColonies } from '@/lib/data/colonies/read';
import { getSettings } from '@/lib/data/settings/settings';
import { listTagsOnColonies } from '@/lib/data/supers/tags';
import { todayIn } from '@/lib/domain/local-date';
import { PageHeader } from '@/components/ui/page-header';
import { Caution } from '@/components/ui/caution';
import { PullPass } from '@/components/yards/pull-pass';
import { recordPullsAction } from '../../actions';

export const metadata = { title: 'Record pulls' };

export default async function RecordPullsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('supers.write', `/admin/yards/${id}/pulls`);
  const yard = await getYard(user, Number(id));
  if (!yard) notFound();
  const settings = await getSettings();
  const { rows } = await listColonies(user, {
    page: 1,
    pageSize: 100,
    sort: 'code',
    dir: 'asc',
    yardId: yard.id,
    status: 'active',
  });
  const tagsOn = await listTagsOnColonies(rows.map((c) => c.id));
  return (
    <>
      <PageHeader
        title={`Record pulls: ${yard.name}`}
        lead={<Link href={`/admin/yards/${yard.id}`}>Back to the yard</Link>}
      />
      <div className="mx-auto max-w-xl space-y-4">
        <Caution title="Lifting caution">
          A full super can weigh 20–40 kg. Lift with your legs, and get help or use a cart for heavy boxes.
        </Caution>
        <PullPass
          colonies={rows.map((c) => ({
            id: c.id,
            code: c.code,
            lastPulledOn: c.lastPulledOn,
            tags: tagsOn[c.id] ?? [],
          }))}
          today={todayIn(settings.timeZone)}
          defaultUnit={settings.weightSystem === 'us' ? 'lb' : 'kg'}
          onSave={recordPullsAction}
          userId={user.id}
          yardName={yard.name}
        />
      </div>
    </>
  );
}
