import { requirePermission } from '@/lib/auth/session';
import { listAssignableKeepers } from '@/lib/data/yards/yards';
import { PageHeader } from '@/components/ui/page-header';
import { YardForm } from '@/components/yards/yard-form';
import { createYardAction } from '../actions';

export const metadata = { title: 'New yard' };

export default async function NewYardPage() {
  await requirePermission('yards.manage', '/admin/yards/new');
  return (
    <>
      <PageHeader title="New yard" />
      <YardForm keepers={await listAssignableKeepers()} onSave={createYardAction} />
    </>
  );
}
