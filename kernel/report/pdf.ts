import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { writeFileAtomic } from '../../lib/internal.js';
import { openChromium } from './chromium.js';

/**
 * Prints a report HTML file to PDF with headless Chromium, scripting disabled: every figure
 * prints as the static rendering the report carries beside its interactive plot (our own SVG,
 * vector in the PDF), so the PDF does not depend on the plotting library's drawing or timing.
 * A report with a figure that has no static rendering (a notebook executed before figures
 * carried one) is printed with scripts on, after the page has drawn its figures. The page is
 * laid out at a print-like width, print styles are applied, and the PDF is written atomically.
 */
export async function printReportPdf(htmlPath: string, pdfPath: string, timeoutMs = 60_000): Promise<void> {
  writeFileAtomic(pdfPath, await reportPdfBytes(htmlPath, timeoutMs));
}

/** As `printReportPdf`, returning the PDF's bytes (for a caller that writes several outputs together). */
export async function reportPdfBytes(htmlPath: string, timeoutMs = 60_000): Promise<Uint8Array> {
  // A4 (210 mm) less the 2 × 12 mm margins below is 186 mm ≈ 703 CSS px: lay the page out at that width.
  const scripted = readFileSync(htmlPath, 'utf8').includes('class="sg-figure-fallback"');
  const browser = await openChromium({ width: 703, height: 1000 }, { javaScriptEnabled: scripted });
  try {
    const page = await browser.context.newPage();
    await page.goto(pathToFileURL(htmlPath).href, { waitUntil: 'load', timeout: timeoutMs });
    if (scripted) await page.waitForSelector('body[data-figures="drawn"], body[data-figures="failed"]', { timeout: timeoutMs, state: 'attached' });
    await page.emulateMedia({ media: 'print' });
    if (scripted) {
      await page.evaluate(async () => {
        const w = window as unknown as { Plotly?: { Plots: { resize(n: Element): Promise<unknown> } } };
        const plotly = w.Plotly;
        if (plotly) await Promise.all(Array.from(document.querySelectorAll('[data-sg-figure]'), (n) => plotly.Plots.resize(n)));
      });
    }
    const pdf = await page.pdf({ format: 'A4', printBackground: true, margin: { top: '14mm', bottom: '14mm', left: '12mm', right: '12mm' } });
    return pdf;
  } finally {
    await browser.close();
  }
}
