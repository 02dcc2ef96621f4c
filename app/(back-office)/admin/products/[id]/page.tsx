import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { getSettings } from '@/lib/data/settings/settings';
import { getProduct } from '@/lib/data/products/products';
import { PageHeader } from '@/components/ui/page-header';
import { ProductForm } from '@/components/products/product-form';
import { PhotoUpload } from '@/components/products/photo-upload';
import { saveProductAction } from '../actions';

export const metadata = { title: 'Product' };

export default async function ProductPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePermission('products.manage', `/admin/products/${id}`);
  const product = /^\d{1,9}$/.test(id) ? await getProduct(Number(id)) : null;
  if (!product) notFound();
  const settings = await getSettings();
  return (
    <>
      <PageHeader
        title={product.name}
        actions={
          <Link className="btn-secondary" href="/admin/products">
            All products
          </Link>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <section className="card">
          <ProductForm
            companyPrefix={settings.gs1CompanyPrefix}
            onSave={saveProductAction}
            defaults={{
              productId: product.id,
              name: product.name,
              slug: product.slug,
              description: product.description,
              netAmount: product.declaredAmount,
              netUnit: product.declaredUnit,
              containerKind: product.containerKind,
              containerGrams: product.containerGrams,
              price: (product.priceCents / 100).toFixed(2),
              active: product.active,
              gtinMode: product.gtin ? 'typed' : 'none',
              gtin: product.gtin ?? '',
            }}
          />
        </section>
        <section className="h-fit card">
          <h2 className="mb-3">Photo</h2>
          <PhotoUpload productId={product.id} photoId={product.photoId} />
        </section>
      </div>
    </>
  );
}
