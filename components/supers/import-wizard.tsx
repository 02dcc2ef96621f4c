'use client';
import { useState } from 'react';
import { toCsv } from '@/lib/domain/csv';
import type { PullMapping, PullRowError, ValidPullRow } from '@/lib/domain/super-pull-import';
import { importSheetInput, type ImportSheetInput } from '@/lib/schemas/supers';
import type { ActionResult } from '@/lib/schemas/result';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { postForm } from '@/components/ui/post-form';
import { TableHead, num } from '@/components/ui/table-parts';

type Preview = {
  headers: string[];
  mapping: Partial<PullMapping>;
  valid: ValidPullRow[];
  errors: PullRowError[];
  total: number;
};
type Imported = { imported: number; flagged: number; errors: PullRowError[] };
const FIELDS: { key: keyof PullMapping; label: string; required?: boolean }[] = [
  { key: 'colonyCode', label: 'Colony code', required: true },
  { key: 'pulledOn', label: 'Pull date (YYYY-MM-DD)', required: true },
  { key: 'depth', label: 'Box depth', required: true },
  { key: 'frameCount', label: 'Frames' },
  { key: 'fullWeight', label: 'Full weight' },
  { key: 'weightUnit', label: 'Weight unit (kg/lb)' },
  { key: 'cappedFrames', label: 'Capped frames' },
  { key: 'tagCode', label: 'Tag code' },
];

/** Posts the sheet for a preview or the import; a refused import says that nothing was imported. */
async function sendSheet(v: ImportSheetInput): Promise<ActionResult<Preview | Imported>> {
  const form = new FormData();
  form.set('file', v.file);
  form.set('mode', v.mode);
  if (v.mapping) form.set('mapping', JSON.stringify(v.mapping));
  if (v.expectedValid !== undefined) form.set('expectedValid', String(v.expectedValid));
  try {
    const r = await postForm<Preview | Imported>('/api/super-pulls/import', form, () => 'The import was refused.');
    return !r.ok && v.mode === 'commit' ? { ...r, message: `${r.message} Nothing was imported.` } : r;
  } catch {
    return { ok: false, message: 'Could not reach the server. Nothing was imported.' };
  }
}

/** Upload → map columns → preview every row → import all valid rows at once → rejected rows as CSV. */
export function ImportWizard() {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [mapping, setMapping] = useState<Partial<PullMapping>>({});
  const [rejected, setRejected] = useState<PullRowError[]>([]);
  // Both requests go through the one form hook: the file checks first, then its message and pending state.
  const { run, pending: busy, message, setMessage } = useActionForm({ schema: importSheetInput, action: sendSheet });

  async function check(f: File, m?: Partial<PullMapping>) {
    const r = await run({ file: f, mode: 'preview', mapping: m });
    if (!r?.ok) {
      setPreview(null);
      return;
    }
    const p = r.data as Preview;
    setFile(f);
    setPreview(p);
    setMapping(p.mapping);
    setRejected(p.errors);
  }

  function choose(f: File | undefined) {
    setPreview(null);
    setMessage({});
    if (f) void check(f);
  }

  async function commit() {
    if (!file || !preview) return;
    const r = await run({ file, mode: 'commit', mapping, expectedValid: preview.valid.length });
    if (!r?.ok) return;
    const body = r.data as Imported;
    setRejected(body.errors);
    setMessage({
      success: `Imported ${body.imported} super pulls${body.flagged ? `, ${body.flagged} of them flagged` : ''}.${body.errors.length ? ` ${body.errors.length} rows were not imported: download them, fix and import again.` : ''}`,
    });
    setPreview(null);
  }

  function downloadRejected() {
    const headers = [...(preview?.headers ?? Object.keys(rejected[0]?.raw ?? {})), 'Problems'];
    const csv = toCsv(
      headers,
      rejected.map((e) => [...headers.slice(0, -1).map((h) => e.raw[h] ?? ''), e.messages.join('; ')]),
    );
    const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv' }));
    const a = Object.assign(document.createElement('a'), { href: url, download: 'rejected-rows.csv' });
    a.click();
    URL.revokeObjectURL(url);
  }

  const errorsByRow = new Map((preview?.errors ?? []).map((e) => [e.row, e]));
  const validByRow = new Map((preview?.valid ?? []).map((v) => [v.row, v]));
  return (
    <div className="space-y-4">
      <label className="field card" htmlFor="sheet">
        <span>Field sheet (CSV, at most 5 MB, dates as YYYY-MM-DD)</span>
        <input
          id="sheet"
          type="file"
          accept=".csv,text/csv"
          className="input min-h-11"
          onChange={(e) => choose(e.target.files?.[0])}
        />
      </label>
      <FormMessage {...message} />
      {rejected.length > 0 && !preview ? (
        <button type="button" className="btn-secondary min-h-11" onClick={downloadRejected}>
          Download rejected rows (CSV)
        </button>
      ) : null}
      {preview ? (
        <>
          <fieldset className="grid gap-3 card sm:grid-cols-2 lg:grid-cols-4">
            <legend className="font-heading text-lg font-bold">Columns</legend>
            {FIELDS.map((f) => (
              <label key={f.key} className="field" htmlFor={`map-${f.key}`}>
                <span>
                  {f.label}
                  {f.required ? '' : ' (optional)'}
                </span>
                <select
                  id={`map-${f.key}`}
                  className="input min-h-11"
                  value={mapping[f.key] ?? ''}
                  onChange={(e) => setMapping((m) => ({ ...m, [f.key]: e.target.value || undefined }))}
                >
                  <option value="">—</option>
                  {preview.headers.map((h) => (
                    <option key={h} value={h}>
                      {h}
                    </option>
                  ))}
                </select>
              </label>
            ))}
            <div className="flex items-end">
              <button
                type="button"
                className="btn-secondary min-h-11"
                disabled={busy || !file}
                onClick={() => file && check(file, mapping)}
              >
                Check again
              </button>
            </div>
          </fieldset>
          <p role="status">
            {preview.total} rows: {preview.valid.length} ready, {preview.errors.length} with problems.
          </p>
          <div className="overflow-x-auto card p-0">
            <table className="data-table">
              <caption className="sr-only">Preview of every row</caption>
              <TableHead columns={['Row', 'Colony', 'Date', 'Box', num('Weight'), 'Tag', 'Check']} />
              <tbody>
                {Array.from({ length: preview.total }, (_, i) => i + 1)
                  .filter((row) => errorsByRow.has(row) || validByRow.has(row))
                  .map((row) => {
                    const v = validByRow.get(row);
                    const e = errorsByRow.get(row);
                    const raw = e?.raw ?? {};
                    return (
                      <tr key={row} className={e ? 'bg-bad-bg/40' : undefined}>
                        <td className="num">{row}</td>
                        <td>{v?.colonyCode ?? raw[mapping.colonyCode ?? ''] ?? ''}</td>
                        <td>{v?.pulledOn ?? raw[mapping.pulledOn ?? ''] ?? ''}</td>
                        <td>{v?.depth ?? raw[mapping.depth ?? ''] ?? ''}</td>
                        <td className="num">
                          {v
                            ? v.fullGrams
                              ? `${(v.fullGrams / 1000).toFixed(2)} kg`
                              : '—'
                            : (raw[mapping.fullWeight ?? ''] ?? '')}
                        </td>
                        <td>{v?.tagCode ?? raw[mapping.tagCode ?? ''] ?? ''}</td>
                        <td>
                          {e ? (
                            <ul className="text-sm text-bad-fg">
                              {e.messages.map((m) => (
                                <li key={m}>{m}</li>
                              ))}
                            </ul>
                          ) : (
                            <span className="text-ok-fg">ready</span>
                          )}
                        </td>
                      </tr>
                    );
                  })}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="btn-primary min-h-11"
              disabled={busy || preview.valid.length === 0}
              onClick={commit}
            >
              {busy ? 'Importing…' : `Import ${preview.valid.length} rows`}
            </button>
            {preview.errors.length ? (
              <button type="button" className="btn-secondary min-h-11" onClick={downloadRejected}>
                Download rejected rows (CSV)
              </button>
            ) : null}
          </div>
        </>
      ) : null}
    </div>
  );
}
