import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../lib/io/writeFileAtomic.js';

describe('writeFileAtomic', () => {
  it('replaces the target with the new bytes and leaves no temporary file beside it', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-atomic-'));
    const file = join(dir, 'fits.csv');
    writeFileSync(file, 'old\n');
    writeFileAtomic(file, 'event,track\n1,1\n');
    writeFileAtomic(join(dir, 'bytes.bin'), new Uint8Array([0, 255, 7]));
    expect(readFileSync(file, 'utf8')).toBe('event,track\n1,1\n');
    expect([...readFileSync(join(dir, 'bytes.bin'))]).toEqual([0, 255, 7]);
    expect(readdirSync(dir).sort()).toEqual(['bytes.bin', 'fits.csv']);
  });

  it('a write into a missing folder throws and leaves the folder as it was', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-atomic-'));
    writeFileSync(join(dir, 'keep.txt'), 'kept');
    expect(() => writeFileAtomic(join(dir, 'missing', 'x.csv'), 'x')).toThrow(/ENOENT/);
    expect(readdirSync(dir)).toEqual(['keep.txt']);
  });
});
