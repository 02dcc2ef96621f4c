import { requirePermission } from '@/lib/auth/session';
import { floralSourceSuggestions } from '@/lib/data/lots/lots';
import { PageHeader } from '@/components/ui/page-header';
import { NewLotForm } from '@/components/lots/new-lot-form';
import { createLotAction } from '../actions';

export const metadata = { title: 'New lot' };

export default async function NewLotPage() {
  await requirePermission('lots.write', '/admin/lots/new');
  return (
    <>
      <PageHeader
        title="New extraction lot"
        lead="The lot gets the next code when you start it; then scan the supers that go into it."
      />
      <NewLotForm suggestions={await floralSourceSuggestions()} onCreate={createLotAction} />
    </>
  );
}
