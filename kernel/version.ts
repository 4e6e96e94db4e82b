import { readFileSync } from 'node:fs';
import path from 'node:path';
import { packageRoot } from './packageMode.js';

let cached: string | undefined;

/** The version in this package's package.json (read once). */
export function sagittaVersion(): string {
  if (cached === undefined) {
    cached = (JSON.parse(readFileSync(path.join(packageRoot, 'package.json'), 'utf8')) as { version: string }).version;
  }
  return cached;
}
