import { requirePermission } from '@/lib/auth/session';
import { listTags } from '@/lib/data/supers/tags';
import { BUILT_IN_LAYOUTS } from '@/lib/domain/label-layout';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/select-field';
import { TagBatchForm } from '@/components/supers/tag-batch-form';
import { createTagBatchAction } from '../actions';

export const metadata = { title: 'Super tags' };

export default async function SuperTagsPage() {
  await requirePermission('superTags.print', '/admin/supers/tags');
  const tags = await listTags(undefined, 5000);
  const prefixes = [...new Set(tags.map((t) => t.code.split('-')[0]))];
  return (
    <>
      <PageHeader
        title="Super tags"
        lead="Each super box carries a tag with its code and a Code 128 barcode, so the crew can scan supers into a lot."
      />
      <div className="space-y-4">
        <section className="card">
          <h2 className="mb-3">Create a batch</h2>
          <TagBatchForm onSave={createTagBatchAction} />
        </section>
        <section className="card">
          <h2 className="mb-3">Print a sheet</h2>
          <p className="mb-3 text-sm">
            {tags.length} tags in use{prefixes.length ? ` (prefixes ${prefixes.join(', ')})` : ''}.
          </p>
          <form method="get" action="/api/super-tags/sheet" className="grid gap-3 sm:grid-cols-3 sm:items-end">
            <SelectField
              id="prefix"
              name="prefix"
              label="Prefix (blank for all)"
              options={[{ value: '', label: 'All tags' }, ...prefixes]}
            />
            <SelectField id="layout" name="layout" label="Label sheet" options={BUILT_IN_LAYOUTS.map((l) => l.name)} />
            <button type="submit" className="btn-primary min-h-11" disabled={tags.length === 0}>
              Download PDF
            </button>
          </form>
        </section>
      </div>
    </>
  );
}
