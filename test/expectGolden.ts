import { existsSync, readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { expect } from 'vitest';
import { writeFileAtomic } from '../lib/io/writeFileAtomic.js';

/** How long an update switch stays valid after it was set [s]: one run, not a shell session. */
export const GOLDEN_SWITCH_LIFETIME_S = 600;

/**
 * Whether this run may rewrite golden files. The switch is `SAGITTA_UPDATE_GOLDEN=<unix seconds
 * when set>` (`npm run update-golden -- <test files>` sets it for one run); a value older than
 * ten minutes, in the future, or not a time is refused with an error, so an exported switch left
 * in a shell cannot quietly rewrite the files later. Under CI the switch is refused outright.
 */
export function goldenUpdateRequested(env: NodeJS.ProcessEnv = process.env, nowS = Date.now() / 1000): boolean {
  const value = env.SAGITTA_UPDATE_GOLDEN;
  if (value === undefined || value === '') return false;
  if (env.CI) throw new Error('SAGITTA_UPDATE_GOLDEN is set under CI: golden files are never written in CI; unset it');
  const setAt = Number(value);
  if (!/^\d{9,}$/.test(value) || !(nowS - setAt >= -5 && nowS - setAt <= GOLDEN_SWITCH_LIFETIME_S)) {
    throw new Error(`SAGITTA_UPDATE_GOLDEN=${value} is not a time set within the last ${GOLDEN_SWITCH_LIFETIME_S / 60} minutes; use npm run update-golden -- <test files> (it sets the time for one run), or unset it`);
  }
  return true;
}

/**
 * Compares rendered text with a golden file (STYLE.md §10, §20). Regenerating is a deliberate act:
 * only with a fresh update switch (see above), never under CI, and never because a file is
 * missing — a missing golden file fails the test and nothing is written, so the next run cannot
 * pass against a file nobody looked at. After an update, review the diff before committing.
 */
export function expectGolden(file: string, actual: string, env: NodeJS.ProcessEnv = process.env): void {
  if (goldenUpdateRequested(env)) {
    writeFileAtomic(file, actual);
    process.stderr.write(`golden file ${file} written; review the diff before committing\n`);
    return;
  }
  if (!existsSync(file)) {
    throw new Error(`golden file ${basename(file)} is missing; write it deliberately with npm run update-golden -- <this test file>, then review and commit it`);
  }
  expect(actual).toBe(readFileSync(file, 'utf8'));
}
