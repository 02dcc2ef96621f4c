'use client';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { CameraScan } from '@/components/lots/camera-scan';

/**
 * A super's tag: typed, picked from the list (a datalist of the tags that fit: free tags for a
 * super going on, the hive's tags for a pull) or read by the camera where the browser can. The
 * server upper-cases and checks it against the printed tag list.
 */
export function TagInput({
  id,
  label,
  tags,
  registration,
  error,
  onScan,
}: {
  id: string;
  label: string;
  tags: string[];
  registration: UseFormRegisterReturn;
  error?: { message?: string };
  onScan: (code: string) => void;
}) {
  const listId = `${id}-tags`;
  return (
    <div className="field">
      <label htmlFor={id}>{label}</label>
      <input
        id={id}
        className="input min-h-11 font-mono uppercase"
        list={listId}
        autoCapitalize="characters"
        autoComplete="off"
        spellCheck={false}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        {...registration}
      />
      <datalist id={listId}>
        {tags.map((t) => (
          <option key={t} value={t} />
        ))}
      </datalist>
      <small className="hint">
        {tags.length > 0
          ? `Type, pick from ${tags.length} tag${tags.length === 1 ? '' : 's'}, or scan.`
          : 'Type or scan.'}
      </small>
      <CameraScan onCode={(code) => onScan(code.trim().toUpperCase())} />
      {error?.message ? (
        <small id={`${id}-error`} className="field-error" role="alert">
          {error.message}
        </small>
      ) : null}
    </div>
  );
}
