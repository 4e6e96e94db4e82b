import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';

/**
 * Compares rendered text with a golden file in test/plot/golden/. Set SAGITTA_UPDATE_GOLDEN=1 to
 * (re)write the golden files after a deliberate change, then review the diff before committing.
 */
export function expectGolden(name: string, actual: string): void {
  const file = join(import.meta.dirname, 'golden', name);
  if (process.env.SAGITTA_UPDATE_GOLDEN === '1' || !existsSync(file)) {
    writeFileSync(file, actual);
    if (process.env.SAGITTA_UPDATE_GOLDEN !== '1') throw new Error(`golden file ${name} was missing and has been written; review and commit it`);
    return;
  }
  expect(actual).toBe(readFileSync(file, 'utf8'));
}
