'use client';
import { useState, type ComponentProps } from 'react';
import type { DefaultValues, FieldValues } from 'react-hook-form';
import { useRouter } from 'next/navigation';
import type { z } from 'zod';
import {
  feedingInput,
  feedingEndInput,
  treatmentInput,
  noteInput,
  splitInput,
  moveInput,
  statusInput,
  FEEDING_KINDS,
} from '@/lib/schemas/colonies';
import { superOnInput, SUPER_DEPTHS } from '@/lib/schemas/supers';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { SelectField, namedChoices } from '@/components/ui/select-field';
import { FormMessage } from '@/components/ui/form-message';
import { newEntryKey } from '@/components/ui/entry-key';
import { useActionForm, type AnyResult, type ResultData } from '@/components/ui/use-action-form';
import { TagInput } from '@/components/supers/tag-input';
import { TreatmentCaution } from './treatment-caution';
import { markedMessage, SupersWarning, type SuperWarningView } from './supers-warning';

type Save<S extends z.ZodType, Res extends AnyResult = AnyResult> = (v: z.input<S>) => Promise<Res>;
/** A feeding or treatment answer: saved, or held back with the supers it would touch. */
type RecordAnswer = ActionResult<{ saved: boolean; reflagged: number; warning: SuperWarningView | null }>;

/** Not saved: the keeper chose to take the supers off first. */
const TAKE_OFF_FIRST =
  'Not saved. Take the supers off and record their pull, then save this again (or start it the day after the pull).';
type Base = { colonyId: number; today: string };

/** Fresh key after every saved entry: a retry of the same entry reuses it, a new entry never does. */
function useEntryKey() {
  const [key, setKey] = useState(newEntryKey);
  return { key, renew: () => setKey(newEntryKey()) };
}

/**
 * The form of one entry sent with its own key: a retry of the same entry reuses the key, the next entry gets a fresh
 * one. A saved entry is confirmed, the form cleared and the page refreshed; `then` (a split) goes elsewhere instead.
 */
function useEntryForm<
  S extends z.ZodType<FieldValues & { idempotencyKey: string }, FieldValues>,
  Res extends AnyResult,
>(
  schema: S,
  onSave: (v: z.output<S>) => Promise<Res>,
  defaultValues: Omit<DefaultValues<z.input<S>>, 'idempotencyKey'>,
  then?: (data: ResultData<Res>) => void,
) {
  const router = useRouter();
  const k = useEntryKey();
  return useActionForm({
    schema,
    action: (v) => onSave({ ...v, idempotencyKey: k.key }),
    defaultValues: { ...defaultValues, idempotencyKey: k.key } as DefaultValues<z.input<S>>,
    ...(then ? {} : { successMessage: 'Saved.', resetOnSuccess: true }),
    onSuccess: (data) => {
      k.renew();
      if (then) then(data);
      else router.refresh();
    },
  });
}

function Submit({ busy, label }: { busy: boolean; label: string }) {
  return (
    <div>
      <button type="submit" className="btn-secondary min-h-11" disabled={busy}>
        {busy ? 'Saving…' : label}
      </button>
    </div>
  );
}

/** A record that runs from one day to another (a feeding, a treatment); the end is blank while it runs. */
function DateSpan({ start, end }: { start: ComponentProps<typeof TextField>; end: ComponentProps<typeof TextField> }) {
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <TextField type="date" {...start} />
      <TextField type="date" {...end} />
    </div>
  );
}

type RecordSchema = z.ZodType<FieldValues & { idempotencyKey: string; onSupers?: 'ask' | 'mark' }, FieldValues>;

/**
 * A feeding or treatment form. The entry goes with its own key (a retry reuses it) and first asks about supers on the
 * hive (`onSupers: 'ask'`). An answer held back for supers shows `warning`: the keeper takes them off first (nothing
 * saved) or saves again with `onSupers: 'mark'`. A saved entry is confirmed (naming any supers marked), the form
 * cleared, the key renewed and the page refreshed.
 */
function useRecordForm<S extends RecordSchema>(
  what: 'feeding' | 'treatment',
  schema: S,
  onSave: (v: z.output<S>) => Promise<RecordAnswer>,
  defaultValues: Omit<DefaultValues<z.input<S>>, 'idempotencyKey' | 'onSupers'>,
) {
  const router = useRouter();
  const k = useEntryKey();
  const [held, setHeld] = useState<SuperWarningView | null>(null);
  const f = useActionForm({
    schema,
    action: (v) => onSave({ ...v, idempotencyKey: k.key }),
    defaultValues: { ...defaultValues, idempotencyKey: k.key, onSupers: 'ask' } as DefaultValues<z.input<S>>,
    successMessage: (r) => (r.saved ? markedMessage(what, r.warning) : undefined),
    onSuccess: (r) => {
      setHeld(r.saved ? null : r.warning);
      if (!r.saved) return;
      f.form.reset();
      k.renew();
      router.refresh();
    },
  });
  const warning = held ? (
    <SupersWarning
      what={what}
      warning={held}
      busy={f.pending}
      onTakeOff={() => {
        setHeld(null);
        f.setMessage({ error: TAKE_OFF_FIRST });
      }}
      onMark={() => void f.run({ ...f.form.getValues(), onSupers: 'mark' })}
    />
  ) : null;
  return { ...f, warning };
}

const FEEDING_NAMES = {
  sugar_syrup: 'Sugar syrup',
  fondant: 'Fondant / candy',
  pollen_substitute: 'Pollen substitute',
  other: 'Other',
} as const;

export function FeedingForm({ colonyId, today, onSave }: Base & { onSave: Save<typeof feedingInput, RecordAnswer> }) {
  const { form, field, submit, pending, message, warning } = useRecordForm('feeding', feedingInput, onSave, {
    colonyId,
    kind: 'sugar_syrup',
    amount: '',
    startedOn: today,
    endedOn: '',
    note: '',
  });
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Record a feeding">
      <SelectField
        id="feed-kind"
        label="Feed"
        registration={form.register('kind')}
        options={FEEDING_KINDS.map((f) => ({ value: f, label: FEEDING_NAMES[f] }))}
      />
      <TextField id="feed-amount" label="Amount" hint="e.g. 2 L 1:1, 1 kg" {...field('amount')} />
      <DateSpan
        start={{ id: 'feed-start', label: 'Started', ...field('startedOn') }}
        end={{ id: 'feed-end', label: 'Ended (blank if still feeding)', ...field('endedOn') }}
      />
      {warning}
      <FormMessage {...message} />
      <Submit busy={pending} label="Save feeding" />
    </form>
  );
}

export function TreatmentForm({
  colonyId,
  today,
  kinds,
  onSave,
}: Base & {
  kinds: { id: number; name: string; supersAllowed: boolean; waitingDays: number }[];
  onSave: Save<typeof treatmentInput, RecordAnswer>;
}) {
  const { form, field, submit, pending, message, warning } = useRecordForm('treatment', treatmentInput, onSave, {
    colonyId,
    treatmentKindId: kinds[0]?.id,
    productName: '',
    appliedOn: today,
    removedOn: '',
    note: '',
  });
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Record a mite treatment">
      <TreatmentCaution />
      <SelectField
        id="treat-kind"
        label="Treatment kind"
        registration={form.register('treatmentKindId')}
        options={kinds.map((x) => ({
          value: x.id,
          label: `${x.name} — ${
            x.supersAllowed
              ? 'supers allowed (per your list)'
              : `no supers${x.waitingDays ? `, wait ${x.waitingDays} d` : ''}`
          }`,
        }))}
      />
      <TextField id="treat-product" label="Product name" {...field('productName')} />
      <DateSpan
        start={{ id: 'treat-on', label: 'Applied', ...field('appliedOn') }}
        end={{ id: 'treat-off', label: 'Removed (blank if still on)', ...field('removedOn') }}
      />
      {warning}
      <FormMessage {...message} />
      <Submit busy={pending} label="Save treatment" />
    </form>
  );
}

export function SuperOnForm({
  colonyId,
  today,
  tags,
  allowUntagged,
  onSave,
}: Base & { tags: string[]; allowUntagged: boolean; onSave: Save<typeof superOnInput> }) {
  const { form, field, submit, pending, message } = useEntryForm(superOnInput, onSave, {
    colonyId,
    depth: 'medium',
    frameCount: 10,
    tagCode: '',
    putOnOn: today,
  });
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Record a super put on">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField id="on-depth" label="Box depth" registration={form.register('depth')} options={SUPER_DEPTHS} />
        <TextField id="on-frames" label="Frames" inputMode="numeric" {...field('frameCount')} />
        <TagInput
          id="on-tag"
          label={allowUntagged ? 'Tag code (optional)' : 'Tag code'}
          tags={tags}
          {...field('tagCode')}
          onScan={(code) => form.setValue('tagCode', code, { shouldValidate: true })}
        />
        <TextField id="on-date" label="Put on" type="date" {...field('putOnOn')} />
      </div>
      <FormMessage {...message} />
      <Submit busy={pending} label="Save super on" />
    </form>
  );
}

export function NoteForm({ colonyId, today, onSave }: Base & { onSave: Save<typeof noteInput> }) {
  const { form, field, submit, pending, errors, message } = useEntryForm(noteInput, onSave, {
    colonyId,
    occurredOn: today,
    note: '',
  });
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Add a note">
      <label className="field" htmlFor="note-text">
        <span>Note</span>
        <textarea id="note-text" className="input min-h-20" {...form.register('note')} />
        {errors.note ? (
          <small className="field-error" role="alert">
            {errors.note.message}
          </small>
        ) : null}
      </label>
      <TextField id="note-date" label="Date" type="date" {...field('occurredOn')} />
      <FormMessage {...message} />
      <Submit busy={pending} label="Save note" />
    </form>
  );
}

export function SplitForm({
  colonyId,
  today,
  onSave,
}: Base & { onSave: Save<typeof splitInput, ActionResult<{ id: number }>> }) {
  const router = useRouter();
  const { field, submit, pending, message } = useEntryForm(
    splitInput,
    onSave,
    { colonyId, newCode: '', occurredOn: today, queenYear: '', note: '' },
    (data) => router.push(`/admin/colonies/${data.id}`),
  );
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Record a split">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id="split-code" label="New colony code" {...field('newCode')} />
        <TextField id="split-date" label="Split on" type="date" {...field('occurredOn')} />
        <TextField id="split-queen" label="New queen year (optional)" inputMode="numeric" {...field('queenYear')} />
      </div>
      <FormMessage {...message} />
      <Submit busy={pending} label="Save split" />
    </form>
  );
}

export function MoveForm({
  colonyId,
  today,
  yards,
  onSave,
}: Base & { yards: { id: number; name: string }[]; onSave: Save<typeof moveInput> }) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: moveInput,
    action: onSave,
    defaultValues: { colonyId, yardId: yards[0]?.id, occurredOn: today, note: '' },
    successMessage: 'Saved.',
    onSuccess: () => router.refresh(),
  });
  if (yards.length === 0) return <p className="hint">No other yard to move to.</p>;
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Move to another yard">
      <SelectField
        id="move-yard"
        label="Move to"
        registration={form.register('yardId')}
        options={namedChoices(yards)}
      />
      <TextField id="move-date" label="Moved on" type="date" {...field('occurredOn')} />
      <FormMessage {...message} />
      <Submit busy={pending} label="Move colony" />
    </form>
  );
}

export function StatusForm({
  colonyId,
  today,
  status,
  onSave,
}: Base & { status: string; onSave: Save<typeof statusInput> }) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: statusInput,
    action: onSave,
    defaultValues: { colonyId, status: status as 'active', combinedIntoCode: '', occurredOn: today, note: '' },
    successMessage: 'Saved.',
    onSuccess: () => router.refresh(),
  });
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Change status">
      <SelectField
        id="status-value"
        label="Status"
        registration={form.register('status')}
        options={[
          'active',
          { value: 'dead_out', label: 'dead-out' },
          { value: 'combined', label: 'combined into another colony' },
          'sold',
        ]}
      />
      {form.watch('status') === 'combined' ? (
        <TextField id="status-into" label="Combined into (colony code)" {...field('combinedIntoCode')} />
      ) : null}
      <TextField id="status-date" label="Date" type="date" {...field('occurredOn')} />
      <TextField id="status-note" label="Note" {...field('note')} />
      <FormMessage {...message} />
      <Submit busy={pending} label="Save status" />
    </form>
  );
}

/** Ends an open feeding or treatment with a date; the colony's supers are re-checked on save. */
export function EndRecordForm({
  label,
  today,
  onEnd,
}: {
  label: string;
  today: string;
  onEnd: (date: string) => Promise<AnyResult>;
}) {
  const router = useRouter();
  // A feeding's end date and a treatment's removal date follow the same rule.
  const { form, submit, pending, errors, message } = useActionForm({
    schema: feedingEndInput.pick({ endedOn: true }),
    action: ({ endedOn }) => onEnd(endedOn),
    defaultValues: { endedOn: today },
    onSuccess: () => router.refresh(),
  });
  return (
    <form className="mt-2 flex flex-wrap items-end gap-2" onSubmit={submit} noValidate>
      <label className="field">
        <span className="text-xs">{label}</span>
        <input
          type="date"
          className="input min-h-11"
          aria-invalid={errors.endedOn ? true : undefined}
          {...form.register('endedOn')}
        />
      </label>
      <button type="submit" className="btn-quiet min-h-11" disabled={pending}>
        {label}
      </button>
      <div className="w-full">
        <FormMessage error={message.error ?? errors.endedOn?.message} />
      </div>
    </form>
  );
}
