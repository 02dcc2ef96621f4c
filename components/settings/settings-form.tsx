'use client';
import type { UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { settingsInput, type SettingsInput } from '@/lib/schemas/settings';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Values = SettingsInput;

function Select({
  label,
  name,
  options,
  form,
}: {
  label: string;
  name: keyof Values;
  options: [string, string][];
  form: UseFormReturn<Values, unknown, z.output<typeof settingsInput>>;
}) {
  return (
    <label className="field" htmlFor={name}>
      <span>{label}</span>
      <select id={name} className="input" {...form.register(name)}>
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </label>
  );
}

export function SettingsForm({
  defaults,
  onSave,
}: {
  defaults: Values;
  onSave: (v: SettingsInput) => Promise<ActionResult>;
}) {
  const {
    form,
    submit,
    pending,
    errors: e,
    message,
  } = useActionForm({
    schema: settingsInput,
    action: onSave,
    defaultValues: defaults,
    successMessage: 'Settings saved.',
  });

  return (
    <form onSubmit={submit} className="space-y-6" noValidate>
      <fieldset className="grid gap-4 card sm:grid-cols-2">
        <legend className="font-heading text-lg font-semibold text-forest-800">Business</legend>
        <TextField label="Business name" registration={form.register('businessName')} error={e.businessName} />
        <TextField
          label="Contact e-mail"
          registration={form.register('contactEmail')}
          error={e.contactEmail}
          type="email"
        />
        <TextField label="Address (labels, footer)" registration={form.register('address')} error={e.address} />
        <TextField label="Region (public lot page)" registration={form.register('region')} error={e.region} />
        <TextField
          label="Time zone"
          registration={form.register('timeZone')}
          error={e.timeZone}
          hint="e.g. Europe/London, America/Chicago"
        />
        <Select
          form={form}
          name="currency"
          label="Currency"
          options={[
            ['usd', 'US dollar'],
            ['eur', 'Euro'],
            ['gbp', 'Pound sterling'],
            ['cad', 'Canadian dollar'],
            ['aud', 'Australian dollar'],
            ['nzd', 'New Zealand dollar'],
          ]}
        />
        <Select
          form={form}
          name="weightSystem"
          label="Show weights in"
          options={[
            ['metric', 'kg and g'],
            ['us', 'lb and oz'],
          ]}
        />
        <label className="field sm:col-span-2" htmlFor="story">
          <span>Shop story</span>
          <textarea id="story" rows={3} className="input" {...form.register('story')} />
        </label>
        <label className="field sm:col-span-2" htmlFor="publicLotNote">
          <span>Note on public lot pages</span>
          <textarea id="publicLotNote" rows={2} className="input" {...form.register('publicLotNote')} />
        </label>
      </fieldset>
      <fieldset className="grid gap-4 card sm:grid-cols-3">
        <legend className="font-heading text-lg font-semibold text-forest-800">Lots and limits</legend>
        <TextField
          label="Lot code prefix"
          registration={form.register('lotCodePrefix')}
          error={e.lotCodePrefix}
          hint="e.g. HH → HH26-014"
        />
        <TextField
          label="Moisture limit, %"
          registration={form.register('moistureLimitPct')}
          error={e.moistureLimitPct}
          inputMode="decimal"
        />
        <TextField
          label="Heather moisture limit, %"
          registration={form.register('moistureLimitHeatherPct')}
          error={e.moistureLimitHeatherPct}
          inputMode="decimal"
        />
        <TextField
          label="US Grade A/B line, %"
          registration={form.register('moistureGradeAPct')}
          error={e.moistureGradeAPct}
          inputMode="decimal"
        />
        <TextField
          label="Best before, months after extraction"
          registration={form.register('bestBeforeMonths')}
          error={e.bestBeforeMonths}
          inputMode="numeric"
        />
        <TextField
          label="Expected jarring loss, %"
          registration={form.register('expectedLossPct')}
          error={e.expectedLossPct}
          inputMode="decimal"
        />
      </fieldset>
      <fieldset className="grid gap-4 card sm:grid-cols-2">
        <legend className="font-heading text-lg font-semibold text-forest-800">Labels and fill checks</legend>
        <TextField
          label="GS1 company prefix"
          registration={form.register('gs1CompanyPrefix')}
          error={e.gs1CompanyPrefix}
          inputMode="numeric"
        />
        <Select
          form={form}
          name="labelDeclaration"
          label="Net quantity on labels"
          options={[
            ['metric', 'Metric only'],
            ['us-dual', 'US and metric'],
          ]}
        />
        <Select
          form={form}
          name="barcodeKind"
          label="Label barcode"
          options={[
            ['gs1-128', 'GS1-128'],
            ['gs1datamatrix', 'GS1 DataMatrix'],
          ]}
        />
        <Select
          form={form}
          name="fillRuleSet"
          label="Fill-weight rules"
          options={[
            ['oiml', 'OIML R 87 / EU 76/211/EEC'],
            ['nist', 'US NIST Handbook 133'],
          ]}
        />
      </fieldset>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary" disabled={pending}>
        Save settings
      </button>
    </form>
  );
}
