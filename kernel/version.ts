import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

/** The version in this package's package.json (read once). */
export function sagittaVersion(): string {
  if (cached === undefined) {
    const path = fileURLToPath(new URL('../package.json', import.meta.url));
    cached = (JSON.parse(readFileSync(path, 'utf8')) as { version: string }).version;
  }
  return cached;
}
