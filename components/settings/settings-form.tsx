'use client';
import type { UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { settingsInput, type SettingsInput } from '@/lib/schemas/settings';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Values = SettingsInput;

const MONTHS = [
  'January (the calendar year)',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July (across New Year, e.g. the southern hemisphere)',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** The settings that are one of a few values: each value with its label. */
const CHOICES = {
  currency: [
    ['usd', 'US dollar'],
    ['eur', 'Euro'],
    ['gbp', 'Pound sterling'],
    ['cad', 'Canadian dollar'],
    ['aud', 'Australian dollar'],
    ['nzd', 'New Zealand dollar'],
  ],
  weightSystem: [
    ['metric', 'kg and g'],
    ['us', 'lb and oz'],
  ],
  seasonStartMonth: MONTHS.map((m, i) => [String(i + 1), m]),
  labelDeclaration: [
    ['metric', 'Metric only'],
    ['us-dual', 'US and metric'],
  ],
  barcodeKind: [
    ['gs1-128', 'GS1-128'],
    ['gs1datamatrix', 'GS1 DataMatrix'],
  ],
  fillRuleSet: [
    ['oiml', 'OIML R 87 / EU 76/211/EEC'],
    ['nist', 'US NIST Handbook 133'],
  ],
} satisfies Partial<Record<keyof Values, [string, string][]>>;

function Select({
  label,
  name,
  form,
}: {
  label: string;
  name: keyof typeof CHOICES;
  form: UseFormReturn<Values, unknown, z.output<typeof settingsInput>>;
}) {
  return (
    <label className="field" htmlFor={name}>
      <span>{label}</span>
      <select id={name} className="input" {...form.register(name)}>
        {CHOICES[name].map(([v, l]) => (
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
  const { form, field, submit, pending, message } = useActionForm({
    schema: settingsInput,
    action: onSave,
    defaultValues: defaults,
    successMessage: 'Settings saved.',
  });

  return (
    <form onSubmit={submit} className="space-y-6" noValidate>
      <fieldset className="grid gap-4 card sm:grid-cols-2">
        <legend className="font-heading text-lg font-semibold text-forest-800">Business</legend>
        <TextField label="Business name" {...field('businessName')} />
        <TextField label="Contact e-mail" {...field('contactEmail')} type="email" />
        <TextField label="Address (labels, footer)" {...field('address')} />
        <TextField label="Region (public lot page)" {...field('region')} />
        <TextField label="Time zone" {...field('timeZone')} hint="e.g. Europe/London, America/Chicago" />
        <Select form={form} name="currency" label="Currency" />
        <Select form={form} name="weightSystem" label="Show weights in" />
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
        <TextField label="Lot code prefix" {...field('lotCodePrefix')} hint="e.g. HH → HH26-014" />
        <TextField label="Moisture limit, %" {...field('moistureLimitPct')} inputMode="decimal" />
        <TextField label="Heather moisture limit, %" {...field('moistureLimitHeatherPct')} inputMode="decimal" />
        <TextField label="US Grade A water limit, %" {...field('moistureGradeAPct')} inputMode="decimal" />
        <TextField label="Best before, months after extraction" {...field('bestBeforeMonths')} inputMode="numeric" />
        <TextField label="Expected jarring loss, %" {...field('expectedLossPct')} inputMode="decimal" />
        <label className="flex items-start gap-2 sm:col-span-2" htmlFor="allowUntaggedSupers">
          <input
            id="allowUntaggedSupers"
            type="checkbox"
            className="mt-1 size-5"
            {...form.register('allowUntaggedSupers')}
          />
          <span>
            Allow supers with no tag (put on and pulled without a printed tag code). Off: every super on and every pull
            names a tag from your tag list.
          </span>
        </label>
        <Select form={form} name="seasonStartMonth" label="Season starts in" />
      </fieldset>
      <fieldset className="grid gap-4 card sm:grid-cols-2">
        <legend className="font-heading text-lg font-semibold text-forest-800">Labels and fill checks</legend>
        <TextField label="GS1 company prefix" {...field('gs1CompanyPrefix')} inputMode="numeric" />
        <Select form={form} name="labelDeclaration" label="Net quantity on labels" />
        <Select form={form} name="barcodeKind" label="Label barcode" />
        <Select form={form} name="fillRuleSet" label="Fill-weight rules" />
      </fieldset>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary" disabled={pending}>
        Save settings
      </button>
    </form>
  );
}
