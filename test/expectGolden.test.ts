import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { expectGolden, goldenUpdateRequested, GOLDEN_SWITCH_LIFETIME_S } from './expectGolden.js';

const now = Math.floor(Date.now() / 1000);

describe('expectGolden: golden files are only ever written on purpose', () => {
  it('a missing golden file fails and is not written (with or without CI)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-golden-'));
    for (const env of [{}, { CI: 'true' }]) {
      const file = join(dir, 'missing.txt');
      expect(() => expectGolden(file, 'new text\n', env)).toThrow(/missing; write it deliberately/);
      expect(existsSync(file)).toBe(false);
    }
  });
  it('under CI the update switch is refused and nothing is written', () => {
    const file = join(mkdtempSync(join(tmpdir(), 'sagitta-golden-')), 'g.txt');
    writeFileSync(file, 'old\n');
    expect(() => expectGolden(file, 'new\n', { CI: 'true', SAGITTA_UPDATE_GOLDEN: String(now) })).toThrow(/never written in CI/);
    expect(readFileSync(file, 'utf8')).toBe('old\n');
  });
  it('a switch left on (older than ten minutes), "1" or a future time is refused, not obeyed', () => {
    expect(() => goldenUpdateRequested({ SAGITTA_UPDATE_GOLDEN: String(now - GOLDEN_SWITCH_LIFETIME_S - 1) }, now)).toThrow(/not a time set within/);
    expect(() => goldenUpdateRequested({ SAGITTA_UPDATE_GOLDEN: '1' }, now)).toThrow(/not a time set within/);
    expect(() => goldenUpdateRequested({ SAGITTA_UPDATE_GOLDEN: String(now + 3600) }, now)).toThrow(/not a time set within/);
    expect(goldenUpdateRequested({}, now)).toBe(false);
  });
  it('a fresh switch rewrites the file; without it a difference fails', () => {
    const file = join(mkdtempSync(join(tmpdir(), 'sagitta-golden-')), 'g.txt');
    writeFileSync(file, 'old\n');
    expect(() => expectGolden(file, 'new\n', {})).toThrow();
    expectGolden(file, 'new\n', { SAGITTA_UPDATE_GOLDEN: String(now) });
    expect(readFileSync(file, 'utf8')).toBe('new\n');
    expectGolden(file, 'new\n', {});
  });
});
