import { existsSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { it } from 'vitest';
import { chromiumPath, openChromium } from '../../kernel/report/index.js';

/**
 * Whether the browser tests can run. Outside CI a missing Chromium skips the browser part; in CI
 * (CI=true) it is an error, so a missing install step cannot pass unnoticed.
 */
export function chromiumAvailable(): boolean {
  const ok = existsSync(chromiumPath());
  if (!ok && process.env.CI) throw new Error(`Chromium not found at ${chromiumPath()}: install Debian's chromium package (.ci/run does)`);
  return ok;
}

/**
 * A test that needs Chromium: without it, an explicit skip outside CI (it shows as skipped, never
 * as passed) and, under CI, a test that runs and fails in `chromiumAvailable`.
 */
export const browserIt = it.skipIf(!existsSync(chromiumPath()) && !process.env.CI);

/** A report opened in headless Chromium, figures drawn; `problems` collects console errors and warnings, page errors and dialogs. */
export interface OpenReport {
  readonly tab: Page;
  readonly problems: string[];
  close(): Promise<void>;
}

export async function openReport(htmlFile: string): Promise<OpenReport> {
  const browser = await openChromium();
  try {
    const tab = await browser.context.newPage();
    const problems: string[] = [];
    tab.on('console', (m) => { if (m.type() === 'error' || m.type() === 'warning') problems.push(m.text()); });
    tab.on('pageerror', (e) => problems.push(e.message));
    tab.on('dialog', (d) => { problems.push(`dialog: ${d.message()}`); void d.dismiss(); });
    await tab.goto(pathToFileURL(htmlFile).href);
    await tab.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 60_000 });
    return { tab, problems, close: () => browser.close() };
  } catch (err) {
    await browser.close();
    throw err;
  }
}
