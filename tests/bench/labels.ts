/**
 * Label sheet benchmark: 1,000 labels (50 lots × 20) on the A4 3×7 layout.
 * Run: npx tsx tests/bench/labels.ts [gs1-128|gs1datamatrix]
 * Fails (exit 1) above 5 s or 300 MB peak RSS.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const LIMIT_SECONDS = 5;
const LIMIT_MB = 300;

// lib/pdf imports 'server-only', which throws outside the react-server condition that
// Next.js sets; re-run this script under that condition (the package then is empty).
if (!process.execArgv.includes('--conditions=react-server')) {
  const run = spawnSync(
    process.execPath,
    ['--conditions=react-server', ...process.execArgv, fileURLToPath(import.meta.url), ...process.argv.slice(2)],
    { stdio: 'inherit' },
  );
  process.exit(run.status ?? 1);
}

const kind = process.argv[2] === 'gs1datamatrix' ? 'gs1datamatrix' : 'gs1-128';
const { BUILT_IN_LAYOUTS } = await import('@/lib/domain/label-layout');
const { declareNetWeightUS } = await import('@/lib/domain/net-quantity');
const { makeGtin } = await import('@/lib/domain/gs1');
const { renderLabelSheet } = await import('@/lib/pdf/labels');

const layout = BUILT_IN_LAYOUTS.find((l) => l.paper === 'a4' && l.columns === 3 && l.rows === 7);
if (!layout) throw new Error('A4 3×7 layout missing');

// Invented demo data, like the demo seed; GS1 prefix 952 is for demonstrations.
const sources = ['Spring blossom', 'Linden', 'Late-summer wildflower', 'Clover', 'Heather'];
const jars = [8, 12, 24];
const labels = Array.from({ length: 50 }, (_, i) => ({
  productName: `${sources[i % sources.length]} Honey`,
  floralSource: sources[i % sources.length],
  netQuantity: declareNetWeightUS(jars[i % jars.length]),
  businessName: 'Hollowmere Apiaries',
  businessAddress: 'Orchard Terrace, Marrow Valley',
  lotCode: `HH26-${String(i + 1).padStart(3, '0')}`,
  bestBefore: '2028-09-30',
  bestBeforeText: '30 Sep 2028',
  gtin: makeGtin('952123454', String(100 + (i % jars.length))),
  publicUrl: `https://hollowmere.example/t/HH26-${String(i + 1).padStart(3, '0')}`,
  copies: 20,
}));

const baselineRss = process.memoryUsage.rss();
let peakRss = baselineRss;
const sampler = setInterval(() => {
  peakRss = Math.max(peakRss, process.memoryUsage.rss());
}, 20);
const started = performance.now();
const pdf = await renderLabelSheet({ layout, labels, barcodeKind: kind });
const seconds = (performance.now() - started) / 1000;
clearInterval(sampler);
peakRss = Math.max(peakRss, process.memoryUsage.rss());
// maxRSS (kB) catches peaks inside synchronous work that the 20 ms sampler cannot see.
const peakMb = Math.max(peakRss / 2 ** 20, process.resourceUsage().maxRSS / 1024);

const out = path.join(process.cwd(), 'tests/.artifacts/bench-labels.pdf');
mkdirSync(path.dirname(out), { recursive: true });
writeFileSync(out, pdf);
console.log(`labels: 1000 (${kind}, ${layout.name})`);
console.log(`elapsed: ${seconds.toFixed(2)} s (limit ${LIMIT_SECONDS} s)`);
console.log(
  `peak RSS: ${peakMb.toFixed(0)} MB (limit ${LIMIT_MB} MB; sampled ${(peakRss / 2 ** 20).toFixed(0)} MB; ${(baselineRss / 2 ** 20).toFixed(0)} MB before rendering)`,
);
console.log(`file: ${(pdf.byteLength / 1024).toFixed(0)} KiB → ${path.relative(process.cwd(), out)}`);
if (seconds > LIMIT_SECONDS || peakMb > LIMIT_MB) {
  console.error('FAIL: over the limit');
  process.exit(1);
}
