'use client';
import { useState } from 'react';
import { Download } from 'lucide-react';

export type LayoutChoice = { key: string; name: string; slots: number; roll: boolean };

/** Pick a layout and a first free slot; the frame shows page one, the button downloads the whole run. */
export function LabelPreview({
  runId,
  layouts,
  jarCount,
}: {
  runId: number;
  layouts: LayoutChoice[];
  jarCount: number;
}) {
  const [layoutKey, setLayoutKey] = useState(layouts[0]?.key ?? 'b0');
  const [start, setStart] = useState(1);
  const layout = layouts.find((l) => l.key === layoutKey);
  const startSlot = layout?.roll ? 0 : Math.min(Math.max(start, 1), layout?.slots ?? 1) - 1;
  const query = `layout=${encodeURIComponent(layoutKey)}&start=${startSlot}`;
  const base = `/api/jarring/${runId}/labels`;
  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <label className="field" htmlFor="layout">
          <span>Label layout</span>
          <select id="layout" className="input" value={layoutKey} onChange={(e) => setLayoutKey(e.target.value)}>
            {layouts.map((l) => (
              <option key={l.key} value={l.key}>
                {l.name}
              </option>
            ))}
          </select>
        </label>
        {layout && !layout.roll ? (
          <label className="field" htmlFor="start">
            <span>Start at label number (1–{layout.slots})</span>
            <input
              id="start"
              className="input"
              type="number"
              inputMode="numeric"
              min={1}
              max={layout.slots}
              value={start}
              onChange={(e) => setStart(Number(e.target.value) || 1)}
            />
            <small className="hint">Skip labels already used on a part sheet.</small>
          </label>
        ) : null}
      </div>
      <a className="btn-primary" href={`${base}?${query}`} download>
        <Download aria-hidden className="h-4 w-4" /> Download {jarCount} labels (PDF)
      </a>
      <iframe
        title="Label preview, first page"
        src={`${base}?${query}&preview=1`}
        className="h-[36rem] w-full rounded-lg border border-line bg-white"
      />
    </div>
  );
}
