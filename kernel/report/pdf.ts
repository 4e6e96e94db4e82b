import { pathToFileURL } from 'node:url';
import { writeFileAtomic } from '../../lib/internal.js';
import { openChromium } from './chromium.js';

/**
 * Prints a report HTML file to PDF with headless Chromium: the page is loaded at a print-like
 * width, figures are drawn (the page marks `data-figures="drawn"`), print styles are applied,
 * and the PDF is written atomically.
 */
export async function printReportPdf(htmlPath: string, pdfPath: string, timeoutMs = 60_000): Promise<void> {
  // A4 (210 mm) less the 2 × 12 mm margins below is 186 mm ≈ 703 CSS px: lay the page out at that width.
  const browser = await openChromium({ width: 703, height: 1000 });
  try {
    const page = await browser.context.newPage();
    await page.goto(pathToFileURL(htmlPath).href, { waitUntil: 'load', timeout: timeoutMs });
    await page.waitForSelector('body[data-figures="drawn"], body[data-figures="failed"]', { timeout: timeoutMs, state: 'attached' });
    await page.emulateMedia({ media: 'print' });
    await page.evaluate(async () => {
      const w = window as unknown as { Plotly?: { Plots: { resize(n: Element): Promise<unknown> } } };
      const plotly = w.Plotly;
      if (plotly) await Promise.all(Array.from(document.querySelectorAll('[data-sg-figure]'), (n) => plotly.Plots.resize(n)));
    });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, margin: { top: '14mm', bottom: '14mm', left: '12mm', right: '12mm' } });
    writeFileAtomic(pdfPath, pdf);
  } finally {
    await browser.close();
  }
}
