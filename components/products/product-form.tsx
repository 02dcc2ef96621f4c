'use client';
import { useRouter } from 'next/navigation';
import { productInput, type ProductInput } from '@/lib/schemas/products';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** A jar size for sale: net quantity in g or oz, container, price, GTIN typed or made from the company prefix. */
export function ProductForm({
  defaults,
  companyPrefix,
  onSave,
}: {
  defaults?: Partial<ProductInput>;
  companyPrefix: string;
  onSave: (v: ProductInput) => Promise<ActionResult<{ id: number; gtin: string | null }>>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: productInput,
    action: onSave,
    defaultValues: {
      netUnit: 'g',
      containerKind: 'glass jar',
      active: true,
      gtinMode: 'none',
      gtin: '',
      itemReference: '',
      slug: '',
      description: '',
      ...defaults,
    },
    successMessage: (saved) => `Saved${saved.gtin ? ` with GTIN ${saved.gtin}` : ''}.`,
    onSuccess: (saved, values) => {
      if (!values.productId) router.push(`/admin/products/${saved.id}`);
      else router.refresh();
    },
  });
  const mode = form.watch('gtinMode');
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Product">
      <TextField label="Name" {...field('name')} />
      <TextField label="Web address (slug)" {...field('slug')} hint="Leave empty to make it from the name." />
      <label className="field" htmlFor="description">
        <span>Description</span>
        <textarea id="description" rows={2} className="input" {...form.register('description')} />
      </label>
      <div className="grid grid-cols-[1fr_7rem] gap-3">
        <TextField label="Net quantity" {...field('netAmount')} inputMode="decimal" />
        <label className="field" htmlFor="netUnit">
          <span>Unit</span>
          <select id="netUnit" className="input" {...form.register('netUnit')}>
            <option value="g">g</option>
            <option value="oz">oz</option>
          </select>
        </label>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Container" {...field('containerKind')} />
        <TextField
          label="Empty container weight, g"
          {...field('containerGrams')}
          inputMode="numeric"
          hint="Jar and lid; taken off gross sample weights."
        />
      </div>
      <TextField label="Price" {...field('price')} inputMode="decimal" />
      <label className="flex min-h-11 items-center gap-2 text-sm">
        <input type="checkbox" {...form.register('active')} /> Active (for sale and jarring)
      </label>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">GTIN (barcode number)</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="none" {...form.register('gtinMode')} /> none yet
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="typed" {...form.register('gtinMode')} /> type it
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="made" {...form.register('gtinMode')} /> make it from our GS1 prefix
          </label>
        </div>
        {mode === 'typed' ? (
          <TextField
            label="GTIN"
            {...field('gtin')}
            inputMode="numeric"
            hint="8, 12, 13 or 14 digits; the last is the check digit."
          />
        ) : null}
        {mode === 'made' ? (
          companyPrefix ? (
            <TextField
              label="Item reference"
              {...field('itemReference')}
              inputMode="numeric"
              hint={`Company prefix ${companyPrefix}; the check digit is computed.`}
            />
          ) : (
            <p className="text-sm text-bad-fg">Set your GS1 company prefix in Settings first.</p>
          )
        ) : null}
      </fieldset>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary" disabled={pending}>
        Save product
      </button>
    </form>
  );
}
