/**
 * Benchmark of the printed card (issue 7). Run: `npx tsx test/bench/pdf.bench.ts`.
 *
 * Node: the median time of one whole card PDF — `cardPdf` (the document definition, QR code
 * and revision marks included) and `renderCardPdf` (pdfmake's layout, the fonts embedded and
 * subset, the PDF written) — for the demo light twin-jet with a 25-row altitude table. Target:
 * under 300 ms.
 *
 * Chromium: the same card made in the page by the code the card screen runs (shared/card-pdf
 * and src/app/cards/browser-pdfmake.ts, bundled here with esbuild and served with the font
 * files at /pdf-fonts/ as the app serves them), driven with playwright-core in Debian's
 * Chromium through test/e2e/browser.ts's launcher. Target: median under 800 ms. The first card
 * (pdfmake and the fonts loading) is printed for information, without a target.
 *
 * Samples are whole cards after a warm-up; the load average is printed beside the figures, as
 * a busy neighbour on a shared machine stretches every sample.
 */
import { build } from 'esbuild';
import { createReadStream, existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { loadavg, tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { buildCard } from '@shared/card/build-card';
import { cardPdf } from '@shared/card-pdf/card-document';
import { cardFontFiles } from '@shared/card-pdf/fonts';
import { renderCardPdf } from '../../server/cards/card-pdf-renderer';
import { launchBrowser } from '../e2e/browser';
import { BENCH_CARD } from './pdf-bench-card';

const NODE_TARGET_MS = 300;
const CHROMIUM_TARGET_MS = 800;
const NODE_SAMPLES = 21;
const CHROMIUM_SAMPLES = 15;

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const load = () => loadavg().map((l) => l.toFixed(1)).join(' ');

async function nodeBench(): Promise<number> {
  const card = buildCard(BENCH_CARD.revision, BENCH_CARD.inputs, BENCH_CARD.context);
  if (card.altitudeTable.length !== 25) throw new Error(`The altitude table has ${card.altitudeTable.length} rows, not 25.`);
  const one = async () => renderCardPdf(cardPdf({ ...BENCH_CARD.print, card, changes: BENCH_CARD.changes(card) }).definition);
  const t0 = performance.now();
  const first = await one();
  const firstMs = performance.now() - t0;
  for (let i = 0; i < 3; i++) await one();
  const samples: number[] = [];
  for (let i = 0; i < NODE_SAMPLES; i++) {
    const start = performance.now();
    await one();
    samples.push(performance.now() - start);
  }
  const result = median(samples);
  console.log(`Node: card PDF (${first.length} bytes), median ${result.toFixed(0)} ms of ${NODE_SAMPLES}, first ${firstMs.toFixed(0)} ms with the fonts loading (target: median under ${NODE_TARGET_MS} ms)`);
  return result;
}

async function chromiumBench(): Promise<number> {
  const dir = mkdtempSync(join(tmpdir(), 'speedwright-pdf-bench-'));
  try {
    await build({
      entryPoints: [join(__dirname, 'pdf-browser-entry.ts')],
      bundle: true,
      format: 'iife',
      platform: 'browser',
      target: 'es2022',
      minify: true,
      outfile: join(dir, 'bench.js'),
      logLevel: 'error',
    });
    writeFileSync(join(dir, 'index.html'), '<!doctype html><meta charset="utf-8"><title>pdf bench</title><script src="/bench.js"></script>');
    const fonts = new Map(cardFontFiles().map((font) => [font.file, join(dirname(require.resolve(`${font.fontsourcePackage}/package.json`)), 'files', font.file)]));
    const server = createServer((req, res) => {
      const path = (req.url ?? '/').split('?')[0];
      const file = path === '/' ? join(dir, 'index.html') : path === '/bench.js' ? join(dir, 'bench.js') : path.startsWith('/pdf-fonts/') ? fonts.get(basename(path)) : undefined;
      if (!file || !existsSync(file)) {
        res.writeHead(404).end();
        return;
      }
      res.writeHead(200, { 'content-type': file.endsWith('.js') ? 'text/javascript' : file.endsWith('.html') ? 'text/html' : 'font/woff' });
      createReadStream(file).pipe(res);
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const port = (server.address() as { port: number }).port;
    const browser = await launchBrowser();
    try {
      const page = await browser.newPage();
      await page.goto(`http://127.0.0.1:${port}/`);
      const { firstMs, samplesMs, bytes } = await page.evaluate((n) => window.runPdfBench(n), CHROMIUM_SAMPLES);
      const result = median(samplesMs);
      console.log(`Chromium: card PDF (${bytes} bytes), median ${result.toFixed(0)} ms of ${CHROMIUM_SAMPLES}, first ${firstMs.toFixed(0)} ms with pdfmake and the fonts loading (target: median under ${CHROMIUM_TARGET_MS} ms)`);
      return result;
    } finally {
      await browser.close();
      server.close();
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const nodeMs = await nodeBench();
  const chromiumMs = await chromiumBench();
  console.log(`load average: ${load()}`);
  let missed = false;
  if (!(nodeMs < NODE_TARGET_MS)) {
    console.log('MISSED: the Node card PDF median is not under its target.');
    missed = true;
  }
  if (!(chromiumMs < CHROMIUM_TARGET_MS)) {
    console.log('MISSED: the Chromium card PDF median is not under its target.');
    missed = true;
  }
  process.exit(missed ? 1 : 0);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
