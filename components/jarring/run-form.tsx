'use client';
import { useState } from 'react';
import Link from 'next/link';
import { jarringRunInput, parseSampleWeights, type JarringRunInput } from '@/lib/schemas/jarring';
import {
  describeReferenceTest,
  referenceTestPlan,
  runReferenceTest,
  tolerableNegativeError,
  type NamedFillCheck,
} from '@/lib/domain/fill-check';
import type { ActionResult } from '@/lib/schemas/result';
import type { RunResult } from '@/lib/data/jarring/runs';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
export type RunFormLot = {
  id: number;
  code: string;
  floralSource: string;
  remainingText: string;
  jars: { productId: number; jars: number }[];
};
export type RunFormProduct = {
  id: number;
  name: string;
  containerGrams: number;
  /** The labelled quantity in grams (Qn). */
  nominalGrams: number;
  netText: string;
};

const newKey = () =>
  typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now()}-${Math.random()}`;

/** The crew's jarring run form: lot, product, jars, sample fill weights. */
export function RunForm({
  lots,
  products,
  ruleSet,
  today,
  onSave,
}: {
  lots: RunFormLot[];
  products: RunFormProduct[];
  ruleSet: 'oiml' | 'nist';
  today: string;
  onSave: (v: JarringRunInput) => Promise<ActionResult<RunResult>>;
}) {
  // The run's outcome (passed, or failed with reasons) is shown in its own panel, not as a message.
  const [result, setResult] = useState<RunResult | null>(null);
  const { form, field, submit, pending, errors, message } = useActionForm({
    schema: jarringRunInput,
    action: (values) => {
      setResult(null);
      return onSave(values);
    },
    defaultValues: {
      lotId: lots[0]?.id ?? 0,
      productId: products[0]?.id ?? 0,
      runOn: today,
      sampleMode: 'net',
      samples: '',
      mavGrams: '',
      idempotencyKey: newKey(),
    },
    // A new run needs a new key; a retry of this one (no answer) keeps it.
    resetOnSuccess: (typed) => ({ ...typed, jarCount: undefined, samples: '', idempotencyKey: newKey() }),
    onSuccess: (data) => setResult(data),
  });
  const lotId = Number(form.watch('lotId'));
  const productId = Number(form.watch('productId'));
  const mode = form.watch('sampleMode');
  const lot = lots.find((l) => l.id === lotId);
  const product = products.find((p) => p.id === productId);
  const canFill = lot?.jars.find((j) => j.productId === productId)?.jars;
  const jarCount = Number(form.watch('jarCount'));
  const typedSamples = form.watch('samples') ?? '';

  const batch = Number.isInteger(jarCount) && jarCount >= 1 && jarCount <= 100_000 ? jarCount : null;
  const guide = ruleSet === 'oiml' && batch !== null ? referenceGuide(batch, product, mode, typedSamples) : null;

  if (lots.length === 0)
    return <p className="hint">No released lot has honey left. Release a lot in the honey house first.</p>;
  if (products.length === 0) return <p className="hint">No active product. The owner adds jar sizes under Products.</p>;

  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="New jarring run">
      <div className="grid gap-4 sm:grid-cols-2">
        <label className="field" htmlFor="lotId">
          <span>Lot (released)</span>
          <select id="lotId" className="input" {...form.register('lotId')}>
            {lots.map((l) => (
              <option key={l.id} value={l.id}>
                {l.code} · {l.floralSource || 'honey'} · {l.remainingText} left
              </option>
            ))}
          </select>
        </label>
        <label className="field" htmlFor="productId">
          <span>Product</span>
          <select id="productId" className="input" {...form.register('productId')}>
            {products.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.netText})
              </option>
            ))}
          </select>
        </label>
      </div>
      {canFill !== undefined ? (
        <p className="hint" aria-live="polite">
          This lot can still fill about <strong data-testid="can-fill">{canFill}</strong> jars of this product (after
          the expected loss).
        </p>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Jars filled"
          {...field('jarCount')}
          inputMode="numeric"
          hint={
            ruleSet === 'oiml'
              ? 'The jars of this run are the batch for the reference test (76/211/EEC Annex II).'
              : 'US rules (NIST Handbook 133): average and MAV; the EU reference test does not apply.'
          }
        />
        <TextField label="Date" type="date" {...field('runOn')} />
      </div>
      {guide ? (
        <div className="space-y-1 rounded-lg bg-info-bg px-3 py-2 text-sm" aria-live="polite" data-testid="weigh-plan">
          <p>
            {guide.plan}{' '}
            <strong>
              Weigh <span data-testid="jars-to-weigh">{guide.firstSample}</span> jars
            </strong>
            {guide.firstSample === guide.batch ? ' (every jar).' : ' (first sample).'}
          </p>
          {guide.secondRule ? <p className="hint">{guide.secondRule}</p> : null}
          {guide.progress ? <p data-testid="weigh-progress">{guide.progress}</p> : null}
        </div>
      ) : null}
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Sample weights are</legend>
        <div className="flex flex-wrap gap-4">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="net" {...form.register('sampleMode')} /> net (honey only)
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="gross" {...form.register('sampleMode')} /> gross (jar and lid included
            {product ? `, ${product.containerGrams} g taken off` : ''})
          </label>
        </div>
      </fieldset>
      <label className="field" htmlFor="samples">
        <span>Sample fill weights, g</span>
        <textarea
          id="samples"
          rows={3}
          className="input"
          inputMode="decimal"
          placeholder={mode === 'gross' ? 'e.g. 542, 545, 541' : 'e.g. 342, 345, 341'}
          aria-invalid={errors.samples ? true : undefined}
          aria-describedby="samples-hint"
          {...form.register('samples')}
        />
        <small id="samples-hint" className="hint">
          Weigh jars taken through the run; separate weights with commas or spaces.
        </small>
        {errors.samples?.message ? (
          <small className="field-error" role="alert">
            {errors.samples.message}
          </small>
        ) : null}
      </label>
      {ruleSet === 'nist' ? (
        <TextField
          label="MAV for this package, g"
          {...field('mavGrams')}
          inputMode="decimal"
          hint="US rules (NIST Handbook 133): Combtrace does not hold the handbook's MAV table. Look up the maximum allowable variation for this labelled weight in Appendix A, Table 2-5, and enter it in grams."
        />
      ) : null}
      <input type="hidden" {...form.register('idempotencyKey')} />
      <FormMessage {...message} />
      {result ? (
        result.pass ? (
          <div role="status" className="rounded-lg bg-ok-bg px-3 py-2 text-sm font-medium text-ok-fg">
            Fill check passed; the jars are in stock.{result.packedOut ? ' The lot is now packed out.' : ''}{' '}
            <Link href={`/admin/jarring/${result.runId}`}>Print labels for run {result.runId}</Link>
            <CheckLines checks={result.checks} />
          </div>
        ) : (
          <div role="alert" className="rounded-lg border-2 border-bad-fg bg-bad-bg px-3 py-2 text-sm text-bad-fg">
            <p className="font-semibold">Fill check failed: these jars are not in stock.</p>
            <CheckLines checks={result.checks} />
            <ul className="ml-5 list-disc">
              {result.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
            <p>
              Re-check or re-fill the jars; the owner can override with a written reason.{' '}
              <Link href={`/admin/jarring/${result.runId}`}>Open run {result.runId}</Link>
            </p>
          </div>
        )
      ) : null}
      <button type="submit" className="btn-primary w-full sm:w-auto" disabled={pending}>
        Record jarring run
      </button>
    </form>
  );
}

/** Each fill check by name with its one-line result. */
function CheckLines({ checks }: { checks: NamedFillCheck[] }) {
  return (
    <ul className="mt-1 font-normal" data-testid="run-checks">
      {checks.map((c) => (
        <li key={c.name}>
          {c.name}: {c.summary}
        </li>
      ))}
    </ul>
  );
}

/**
 * What to weigh for a batch of `batch` jars under the reference test (76/211/EEC Annex II), and,
 * once weights are typed, how far the weighing has come and whether a second sample is needed.
 */
function referenceGuide(batch: number, product: RunFormProduct | undefined, mode: string, typed: string) {
  const plan = referenceTestPlan(batch);
  const firstSample = plan.inspectAll ? batch : plan.first.sample;
  const planText = plan.inspectAll
    ? `A batch under 100 jars is checked whole.`
    : `A batch of ${batch} jars is checked by sampling.`;
  const secondRule =
    !plan.inspectAll && plan.second
      ? `After the first ${plan.first.sample}: ${plan.first.accept} or fewer below T1 accepts, ${plan.first.reject} or more rejects; in between, weigh a second sample of ${plan.second.sample} more jars.`
      : null;
  let progress: string | null = null;
  const weights = parseSampleWeights(typed).filter((n) => Number.isFinite(n) && n > 0);
  if (product && weights.length > 0 && product.nominalGrams >= 5) {
    const net = mode === 'gross' ? weights.map((g) => g - product.containerGrams) : weights;
    if (net.every((g) => g > 0)) {
      const r = runReferenceTest(product.nominalGrams, batch, net);
      const t1 = product.nominalGrams - tolerableNegativeError(product.nominalGrams);
      if (r.verdict === 'weigh-more' && r.secondSampleNeeded) {
        progress = `Second sample needed: ${r.defectives} of the first ${r.firstSample} are below T1 (${t1.toFixed(1)} g). Weigh ${r.jarsNeeded - r.weighed} more jars (${r.weighed} of ${r.jarsNeeded}).`;
      } else if (r.verdict === 'weigh-more') {
        progress = `${r.weighed} of ${r.jarsNeeded} jars weighed: weigh ${r.jarsNeeded - r.weighed} more.`;
      } else {
        progress = `Reference test so far: ${describeReferenceTest(r)}.`;
      }
    }
  }
  return { batch, firstSample, plan: planText, secondRule, progress };
}
