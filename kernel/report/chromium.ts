import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext } from 'playwright-core';
import { msg } from '../../lib/internal.js';

/** The system Chromium (Debian package `chromium`); override with SAGITTA_CHROMIUM. Never downloaded. */
export function chromiumPath(): string {
  return process.env.SAGITTA_CHROMIUM ?? '/usr/bin/chromium';
}

/** A headless Chromium with a throw-away profile; `close()` ends it and removes the profile. */
export interface HeadlessChromium {
  readonly context: BrowserContext;
  close(): Promise<void>;
}

/**
 * Starts headless Chromium through playwright-core with flags that keep it quiet and offline
 * (no background networking, updates, sync or first-run pages; no sandbox, since CI runs as root).
 */
export async function openChromium(viewport = { width: 1100, height: 900 }): Promise<HeadlessChromium> {
  const executablePath = chromiumPath();
  if (!existsSync(executablePath)) {
    throw msg.badArgument('Chromium', executablePath, 'an installed Chromium for --pdf (Debian: apt-get install chromium), or SAGITTA_CHROMIUM=/path/to/chromium');
  }
  const { chromium } = await import('playwright-core');
  const profile = mkdtempSync(join(tmpdir(), 'sagitta-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath,
    headless: true,
    viewport,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
