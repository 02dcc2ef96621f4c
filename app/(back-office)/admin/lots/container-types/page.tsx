import { requirePermission } from '@/lib/auth/session';
import { listContainerTypes } from '@/lib/data/lots/container-types';
import { PageHeader } from '@/components/ui/page-header';
import { ContainerTypeForm } from '@/components/lots/container-type-form';
import { saveContainerTypeAction } from '../actions';

export const metadata = { title: 'Container types' };

export default async function ContainerTypesPage() {
  await requirePermission('containerTypes.manage', '/admin/lots/container-types');
  const types = await listContainerTypes(true);
  return (
    <>
      <PageHeader
        title="Container types"
        lead="Buckets, pails, drums and tanks with their usual empty weight; the crew can still enter each container’s own tare."
      />
      <div className="space-y-4 card">
        {types.map((t) => (
          <ContainerTypeForm
            key={t.id}
            onSave={saveContainerTypeAction}
            defaults={{ id: t.id, name: t.name, usualTare: t.usualTareGrams / 1000, unit: 'kg', active: t.active }}
          />
        ))}
        <h2>Add a type</h2>
        <ContainerTypeForm
          onSave={saveContainerTypeAction}
          defaults={{ name: '', usualTare: 0, unit: 'kg', active: true }}
        />
      </div>
    </>
  );
}
