'use client';
import type { ActionResult } from '@/lib/schemas/result';
import type { PullableSuper } from '@/lib/data/lots/supers';
import { pickSupersInput, type PickSupersInput } from '@/lib/schemas/lots';
import { Chip } from '@/components/ui/chip';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { TableHead, num } from '@/components/ui/table-parts';

/** A pullable super with its full weight written out in the business's unit. */
export type PickableSuper = Omit<PullableSuper, 'fullGrams'> & { full: string };

/** Pulled supers in no lot yet: tick and add. Flagged ones go in by scanning with an owner override. */
export function SuperPicker({
  lotId,
  supers,
  onPick,
}: {
  lotId: number;
  supers: PickableSuper[];
  onPick: (v: PickSupersInput) => Promise<ActionResult<unknown>>;
}) {
  const { form, submit, pending, errors, message } = useActionForm({
    schema: pickSupersInput,
    action: onPick,
    defaultValues: { lotId, superPullIds: [] },
    successMessage: (_, values) =>
      `${values.superPullIds.length} super${values.superPullIds.length === 1 ? '' : 's'} added.`,
    resetOnSuccess: true,
  });
  // Ticked boxes (a checkbox group registered as one array field; flagged ones are disabled).
  const picked = form.watch('superPullIds') ?? [];
  if (!supers.length) return <p className="hint">No pulled supers waiting for a lot match these filters.</p>;
  return (
    <form onSubmit={submit} className="space-y-3" noValidate aria-label="Pick pulled supers">
      <div className="max-h-96 overflow-auto">
        <table className="data-table">
          <caption className="sr-only">Pulled supers not yet in a lot</caption>
          <TableHead
            columns={[{ label: 'Pick', hidden: true }, 'Tag', 'Colony', 'Yard', 'Pulled', num('Full'), 'Status']}
          />
          <tbody>
            {supers.map((s) => (
              <tr key={s.id}>
                <td>
                  <input
                    type="checkbox"
                    className="h-5 w-5"
                    aria-label={`Pick super ${s.tagCode ?? s.id}`}
                    value={s.id}
                    disabled={s.flagged}
                    {...form.register('superPullIds')}
                  />
                </td>
                <td className="font-mono">{s.tagCode ?? '—'}</td>
                <td>{s.colonyCode}</td>
                <td>{s.yardName}</td>
                <td>{s.pulledOn}</td>
                <td className="num">{s.full}</td>
                <td>
                  {s.flagged ? (
                    <Chip tone="bad" title={s.flagReasons.join('; ')}>
                      flagged
                    </Chip>
                  ) : (
                    <Chip tone="ok">ready</Chip>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <FormMessage error={message.error ?? errors.superPullIds?.message} success={message.success} />
      <button type="submit" className="btn-secondary" disabled={pending || picked.length === 0}>
        Add {picked.length || ''} ticked super{picked.length === 1 ? '' : 's'}
      </button>
    </form>
  );
}
