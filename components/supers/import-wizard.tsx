'use client';
import { useState } from 'react';
import { toCsv } from '@/lib/domain/csv';
import type { PullMapping, PullRowError, ValidPullRow } from '@/lib/domain/super-pull-import';
import { FormMessage } from '@/components/ui/form-message';

type Preview = { headers: string[]; mapping: Partial<PullMapping>; valid: ValidPullRow[]; errors: PullRowError[]; total: number };
const MAX_BYTES = 5 * 1024 * 1024;
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

async function post(file: File, fields: Record<string, string>): Promise<{ ok: true; body: unknown } | { ok: false; message: string }> {
  const form = new FormData();
  form.set('file', file);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  try {
    const res = await fetch('/api/super-pulls/import', { method: 'POST', body: form });
    const body = await res.json();
    return res.ok ? { ok: true, body } : { ok: false, message: body.error ?? 'The import was refused.' };
  } catch {
    return { ok: false, message: 'Could not reach the server. Nothing was imported.' };
  }
}

/** Upload → map columns → preview every row → import all valid rows at once → rejected rows as CSV. */
export function ImportWizard() {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [mapping, setMapping] = useState<Partial<PullMapping>>({});
  const [error, setError] = useState<string>();
  const [done, setDone] = useState<string>();
  const [busy, setBusy] = useState(false);
  const [rejected, setRejected] = useState<PullRowError[]>([]);

  async function check(f: File, m: Partial<PullMapping> | null) {
    setBusy(true); setError(undefined); setDone(undefined);
    const r = await post(f, { mode: 'preview', ...(m ? { mapping: JSON.stringify(m) } : {}) });
    setBusy(false);
    if (!r.ok) { setError(r.message); setPreview(null); return; }
    const p = r.body as Preview;
    setPreview(p); setMapping(p.mapping); setRejected(p.errors);
  }

  function choose(f: File | undefined) {
    setPreview(null); setDone(undefined);
    if (!f) return;
    if (f.size > MAX_BYTES) { setError('The file is larger than 5 MB. Split it into smaller files.'); setFile(null); return; }
    if (!/\.csv$/i.test(f.name)) { setError('Only CSV files (.csv) can be imported. Save the spreadsheet as CSV first.'); setFile(null); return; }
    setFile(f);
    void check(f, null);
  }

  async function commit() {
    if (!file || !preview) return;
    setBusy(true); setError(undefined);
    const r = await post(file, { mode: 'commit', mapping: JSON.stringify(mapping), expectedValid: String(preview.valid.length) });
    setBusy(false);
    if (!r.ok) { setError(`${r.message} Nothing was imported.`); return; }
    const body = r.body as { imported: number; flagged: number; errors: PullRowError[] };
    setRejected(body.errors);
    setDone(`Imported ${body.imported} super pulls${body.flagged ? `, ${body.flagged} of them flagged` : ''}.${body.errors.length ? ` ${body.errors.length} rows were not imported: download them, fix and import again.` : ''}`);
    setPreview(null);
  }

  function downloadRejected() {
    const headers = [...(preview?.headers ?? Object.keys(rejected[0]?.raw ?? {})), 'Problems'];
    const csv = toCsv(headers, rejected.map((e) => [...headers.slice(0, -1).map((h) => e.raw[h] ?? ''), e.messages.join('; ')]));
    const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv' }));
    const a = Object.assign(document.createElement('a'), { href: url, download: 'rejected-rows.csv' });
    a.click();
    URL.revokeObjectURL(url);
  }

  const errorsByRow = new Map((preview?.errors ?? []).map((e) => [e.row, e]));
  const validByRow = new Map((preview?.valid ?? []).map((v) => [v.row, v]));
  return (
    <div className="space-y-4">
      <label className="card field" htmlFor="sheet">
        <span>Field sheet (CSV, at most 5 MB, dates as YYYY-MM-DD)</span>
        <input id="sheet" type="file" accept=".csv,text/csv" className="input min-h-11" onChange={(e) => choose(e.target.files?.[0])} />
      </label>
      <FormMessage error={error} success={done} />
      {rejected.length > 0 && !preview ? <button type="button" className="btn-secondary min-h-11" onClick={downloadRejected}>Download rejected rows (CSV)</button> : null}
      {preview ? (
        <>
          <fieldset className="card grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            <legend className="font-heading text-lg font-bold">Columns</legend>
            {FIELDS.map((f) => (
              <label key={f.key} className="field" htmlFor={`map-${f.key}`}>
                <span>{f.label}{f.required ? '' : ' (optional)'}</span>
                <select id={`map-${f.key}`} className="input min-h-11" value={mapping[f.key] ?? ''} onChange={(e) => setMapping((m) => ({ ...m, [f.key]: e.target.value || undefined }))}>
                  <option value="">—</option>
                  {preview.headers.map((h) => <option key={h} value={h}>{h}</option>)}
                </select>
              </label>
            ))}
            <div className="flex items-end"><button type="button" className="btn-secondary min-h-11" disabled={busy || !file} onClick={() => file && check(file, mapping)}>Check again</button></div>
          </fieldset>
          <p role="status">{preview.total} rows: {preview.valid.length} ready, {preview.errors.length} with problems.</p>
          <div className="card overflow-x-auto p-0">
            <table className="data-table">
              <caption className="sr-only">Preview of every row</caption>
              <thead><tr><th scope="col">Row</th><th scope="col">Colony</th><th scope="col">Date</th><th scope="col">Box</th><th scope="col" className="num">Weight</th><th scope="col">Tag</th><th scope="col">Check</th></tr></thead>
              <tbody>
                {Array.from({ length: preview.total }, (_, i) => i + 1).filter((row) => errorsByRow.has(row) || validByRow.has(row)).map((row) => {
                  const v = validByRow.get(row);
                  const e = errorsByRow.get(row);
                  const raw = e?.raw ?? {};
                  return (
                    <tr key={row} className={e ? 'bg-bad-bg/40' : undefined}>
                      <td className="num">{row}</td>
                      <td>{v?.colonyCode ?? raw[mapping.colonyCode ?? ''] ?? ''}</td>
                      <td>{v?.pulledOn ?? raw[mapping.pulledOn ?? ''] ?? ''}</td>
                      <td>{v?.depth ?? raw[mapping.depth ?? ''] ?? ''}</td>
                      <td className="num">{v ? (v.fullGrams ? `${(v.fullGrams / 1000).toFixed(2)} kg` : '—') : raw[mapping.fullWeight ?? ''] ?? ''}</td>
                      <td>{v?.tagCode ?? raw[mapping.tagCode ?? ''] ?? ''}</td>
                      <td>{e ? <ul className="text-sm text-bad-fg">{e.messages.map((m) => <li key={m}>{m}</li>)}</ul> : <span className="text-ok-fg">ready</span>}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary min-h-11" disabled={busy || preview.valid.length === 0} onClick={commit}>
              {busy ? 'Importing…' : `Import ${preview.valid.length} rows`}
            </button>
            {preview.errors.length ? <button type="button" className="btn-secondary min-h-11" onClick={downloadRejected}>Download rejected rows (CSV)</button> : null}
          </div>
        </>
      ) : null}
    </div>
  );
}
