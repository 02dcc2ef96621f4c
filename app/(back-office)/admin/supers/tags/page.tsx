import { requirePermission } from '@/lib/auth/session';
import { listTags } from '@/lib/data/supers/tags';
import { BUILT_IN_LAYOUTS } from '@/lib/domain/label-layout';
import { PageHeader } from '@/components/ui/page-header';
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
            <label className="field" htmlFor="prefix">
              <span>Prefix (blank for all)</span>
              <select id="prefix" name="prefix" className="input min-h-11">
                <option value="">All tags</option>
                {prefixes.map((p) => (
                  <option key={p} value={p}>
                    {p}
                  </option>
                ))}
              </select>
            </label>
            <label className="field" htmlFor="layout">
              <span>Label sheet</span>
              <select id="layout" name="layout" className="input min-h-11">
                {BUILT_IN_LAYOUTS.map((l) => (
                  <option key={l.name} value={l.name}>
                    {l.name}
                  </option>
                ))}
              </select>
            </label>
            <button type="submit" className="btn-primary min-h-11" disabled={tags.length === 0}>
              Download PDF
            </button>
          </form>
        </section>
      </div>
    </>
  );
}
