import { existsSync } from 'node:fs';
import { chromiumPath } from '../../kernel/report/index';

/**
 * Whether the browser tests can run. Outside CI a missing Chromium skips the browser part; in CI
 * (CI=true) it is an error, so a missing install step cannot pass unnoticed.
 */
export function chromiumAvailable(): boolean {
  const ok = existsSync(chromiumPath());
  if (!ok && process.env.CI) throw new Error(`Chromium not found at ${chromiumPath()}: install Debian's chromium package (.ci/run does)`);
  return ok;
}
