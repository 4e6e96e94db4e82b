import { pathToFileURL } from 'node:url';
import { writeFileAtomic } from '../notebook/write';
import { openChromium } from './chromium';

/**
 * Prints a report HTML file to PDF with headless Chromium: the page is loaded at a print-like
 * width, figures are drawn (the page marks `data-figures="drawn"`), print styles are applied,
 * and the PDF is written atomically.
 */
export async function printReportPdf(htmlPath: string, pdfPath: string, timeoutMs = 60_000): Promise<void> {
  const browser = await openChromium({ width: 794, height: 1123 });
  try {
    const page = await browser.context.newPage();
    await page.goto(pathToFileURL(htmlPath).href, { waitUntil: 'load', timeout: timeoutMs });
    await page.waitForSelector('body[data-figures="drawn"], body[data-figures="failed"]', { timeout: timeoutMs, state: 'attached' });
    await page.emulateMedia({ media: 'print' });
    await page.evaluate(() => {
      const w = window as unknown as { Plotly?: { Plots: { resize(n: Element): unknown } } };
      document.querySelectorAll('[data-sg-figure]').forEach((n) => w.Plotly?.Plots.resize(n));
    });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, margin: { top: '14mm', bottom: '14mm', left: '12mm', right: '12mm' } });
    writeFileAtomic(pdfPath, pdf);
  } finally {
    await browser.close();
  }
}
