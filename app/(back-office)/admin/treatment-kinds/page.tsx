import { requirePermission } from '@/lib/auth/session';
import { listTreatmentKinds } from '@/lib/data/colonies/records';
import { PageHeader } from '@/components/ui/page-header';
import { TreatmentCaution } from '@/components/colonies/treatment-caution';
import { TreatmentKindForm } from '@/components/treatment-kinds/treatment-kind-form';
import { saveTreatmentKindAction } from './actions';

export const metadata = { title: 'Treatment kinds' };

export default async function TreatmentKindsPage() {
  await requirePermission('treatmentKinds.manage', '/admin/treatment-kinds');
  const kinds = await listTreatmentKinds();
  return (
    <>
      <PageHeader
        title="Treatment kinds"
        lead="The list keepers choose from when they record a mite treatment. Each treatment keeps the values it was recorded with; editing a kind changes only new records."
      />
      <div className="space-y-4">
        <TreatmentCaution />
        <section className="space-y-4 card">
          {kinds.map((k) => (
            <TreatmentKindForm key={k.id} initial={k} onSave={saveTreatmentKindAction} />
          ))}
          {kinds.length === 0 ? <p>No kinds yet.</p> : null}
        </section>
        <section className="card">
          <h2 className="mb-3">Add a kind</h2>
          <TreatmentKindForm onSave={saveTreatmentKindAction} />
        </section>
      </div>
    </>
  );
}
