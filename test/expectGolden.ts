import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import { expect } from 'vitest';

/**
 * Compares rendered text with a golden file (STYLE.md §10). Set SAGITTA_UPDATE_GOLDEN=1 to
 * (re)write the golden files after a deliberate change, then review the diff before committing.
 * A missing golden file is written and the test fails, so a new one is always looked at; with CI
 * set, nothing is ever written and a missing file fails.
 */
export function expectGolden(file: string, actual: string): void {
  if (!existsSync(file) && process.env.CI) throw new Error(`golden file ${basename(file)} is missing; golden files are never written in CI (run the test locally and review the new file)`);
  if (process.env.SAGITTA_UPDATE_GOLDEN === '1' && process.env.CI) throw new Error('SAGITTA_UPDATE_GOLDEN is not honoured in CI');
  if (process.env.SAGITTA_UPDATE_GOLDEN === '1' || !existsSync(file)) {
    writeFileSync(file, actual);
    if (process.env.SAGITTA_UPDATE_GOLDEN !== '1') throw new Error(`golden file ${basename(file)} was missing and has been written; review and commit it`);
    return;
  }
  expect(actual).toBe(readFileSync(file, 'utf8'));
}
