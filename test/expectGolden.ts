import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import { expect } from 'vitest';

/**
 * Compares rendered text with a golden file (STYLE.md §10). Set SAGITTA_UPDATE_GOLDEN=1 to
 * (re)write the golden files after a deliberate change, then review the diff before committing.
 * A missing golden file is written and the test fails, so a new one is always looked at.
 */
export function expectGolden(file: string, actual: string): void {
  if (process.env.SAGITTA_UPDATE_GOLDEN === '1' || !existsSync(file)) {
    writeFileSync(file, actual);
    if (process.env.SAGITTA_UPDATE_GOLDEN !== '1') throw new Error(`golden file ${basename(file)} was missing and has been written; review and commit it`);
    return;
  }
  expect(actual).toBe(readFileSync(file, 'utf8'));
}
