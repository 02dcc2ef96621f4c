import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { getSettings } from '@/lib/data/settings/settings';
import { listProducts } from '@/lib/data/products/products';
import { declareNetQuantity } from '@/lib/domain/net-quantity';
import { formatMoney } from '@/lib/domain/units';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { ProductForm } from '@/components/products/product-form';
import { saveProductAction } from './actions';
import { TableHead, EmptyRow, num } from '@/components/ui/table-parts';

export const metadata = { title: 'Products' };

export default async function ProductsPage() {
  await requirePermission('products.manage', '/admin/products');
  const [settings, products] = await Promise.all([getSettings(), listProducts()]);
  return (
    <>
      <PageHeader
        title="Products"
        lead="The jar sizes the shop sells and the jarring runs fill."
        actions={
          <Link className="btn-secondary" href="/admin/labels">
            Label layouts
          </Link>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="overflow-x-auto card p-0">
          <table className="data-table">
            <caption className="sr-only">Products</caption>
            <TableHead columns={['Name', 'Label declares', 'Container', num('Price'), 'GTIN', 'Status']} />
            <tbody>
              {products.length === 0 ? <EmptyRow columns={6}>No products yet.</EmptyRow> : null}
              {products.map((p) => (
                <tr key={p.id}>
                  <td>
                    <Link href={`/admin/products/${p.id}`}>{p.name}</Link>
                  </td>
                  <td>{declareNetQuantity(p, settings.labelDeclaration)}</td>
                  <td>
                    {p.containerKind}, {p.containerGrams} g
                  </td>
                  <td className="num">{formatMoney(p.priceCents, settings.currency)}</td>
                  <td className="tabular-nums">{p.gtin ?? <Chip tone="warn">none</Chip>}</td>
                  <td>{p.active ? <Chip tone="ok">active</Chip> : <Chip>inactive</Chip>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <section className="card">
          <h2 className="mb-3">Add a product</h2>
          <ProductForm companyPrefix={settings.gs1CompanyPrefix} onSave={saveProductAction} />
        </section>
      </div>
    </>
  );
}
