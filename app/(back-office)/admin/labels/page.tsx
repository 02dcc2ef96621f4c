import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { listLabelLayouts } from '@/lib/data/labels/layouts';
import { BUILT_IN_LAYOUTS } from '@/lib/domain/label-layout';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { LayoutForm } from '@/components/labels/layout-form';
import { DeleteLayoutButton } from '@/components/labels/delete-layout-button';
import { deleteLabelLayoutAction, saveLabelLayoutAction } from './actions';
import { TableHead } from '@/components/ui/table-parts';

export const metadata = { title: 'Label layouts' };

export default async function LabelLayoutsPage({ searchParams }: { searchParams: Promise<{ edit?: string }> }) {
  await requirePermission('labels.layouts', '/admin/labels');
  const [layouts, { edit }] = await Promise.all([listLabelLayouts(), searchParams]);
  const editing = layouts.find((o) => o.key === edit && !o.builtIn);
  const start = editing?.layout ?? { ...BUILT_IN_LAYOUTS[0], name: 'My A4 sheet' };
  return (
    <>
      <PageHeader
        title="Label layouts"
        lead="Sheets and rolls to print jar labels on. Measure your label stock; print one page on plain paper and hold it against a sheet before printing a run."
        actions={
          <Link className="btn-secondary" href="/admin/jarring">
            Jarring
          </Link>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="overflow-x-auto card p-0">
          <table className="data-table">
            <caption className="sr-only">Label layouts</caption>
            <TableHead
              columns={['Name', 'Paper', 'Label, mm', 'Grid', 'Nudge, mm', { label: 'Actions', hidden: true }]}
            />
            <tbody>
              {layouts.map(({ key, id, builtIn, layout: l }) => (
                <tr key={key}>
                  <td>
                    {l.name} {builtIn ? <Chip>built in</Chip> : null}
                  </td>
                  <td className="uppercase">{l.paper}</td>
                  <td className="tabular-nums">
                    {l.labelWidthMm} × {l.labelHeightMm}
                  </td>
                  <td className="tabular-nums">{l.paper === 'roll' ? '1 per page' : `${l.columns} × ${l.rows}`}</td>
                  <td className="tabular-nums">
                    {l.offsetXMm}, {l.offsetYMm}
                  </td>
                  <td>
                    {id ? (
                      <span className="flex gap-1">
                        <Link className="btn-quiet" href={`/admin/labels?edit=${key}`}>
                          Edit
                        </Link>
                        <DeleteLayoutButton layoutId={id} onDelete={deleteLabelLayoutAction} />
                      </span>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <section className="card">
          <h2 className="mb-3">{editing ? `Edit ${editing.layout.name}` : 'New layout'}</h2>
          <LayoutForm
            key={edit ?? 'new'}
            onSave={saveLabelLayoutAction}
            defaults={{ ...start, layoutId: editing?.id ?? undefined }}
          />
        </section>
      </div>
    </>
  );
}
