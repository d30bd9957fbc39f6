/**
 * The Chromium half of pdf.bench.ts, bundled with esbuild: the same code path as the card
 * screen's "Print card" (shared/card-pdf's definition, src/app/cards/browser-pdfmake.ts's
 * pdfmake with the fonts fetched from /pdf-fonts/), timed in the page.
 */
import { buildCard } from '@shared/card/build-card';
import { cardPdf } from '@shared/card-pdf/card-document';
import { NO_CHANGES } from '@shared/card-pdf/revision-marks';
import { loadPdfMake, renderPdfInBrowser } from '../../src/app/cards/browser-pdfmake';
import { BENCH_CARD } from './pdf-bench-card';

declare global {
  interface Window {
    runPdfBench(samples: number): Promise<{ firstMs: number; samplesMs: number[]; bytes: number }>;
  }
}

window.runPdfBench = async (samples: number) => {
  const card = buildCard(BENCH_CARD.revision, BENCH_CARD.inputs, BENCH_CARD.context);
  const one = async () => {
    const { definition } = cardPdf({ ...BENCH_CARD.print, card, changes: BENCH_CARD.changes(card) ?? NO_CHANGES });
    return renderPdfInBrowser(definition);
  };
  const start = performance.now();
  await loadPdfMake();
  const first = await one();
  const firstMs = performance.now() - start;
  for (let i = 0; i < 3; i++) await one();
  const samplesMs: number[] = [];
  for (let i = 0; i < samples; i++) {
    const t0 = performance.now();
    await one();
    samplesMs.push(performance.now() - t0);
  }
  return { firstMs, samplesMs, bytes: first.size };
};
