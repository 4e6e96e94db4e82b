import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { rangeTable } from '../lib/matter/rangeTable.js';
import { material } from '../lib/matter/materials.js';
import { particle } from '../lib/particles.js';
import { provenanceSnapshot, recordCaution, recordInput, recordSeed, resetProvenance } from '../lib/provenance.js';

describe('provenance registry', () => {
  beforeEach(() => resetProvenance());

  it('recordInput(file) stores name, size and the SHA-256 of the bytes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-prov-'));
    const file = join(dir, 'abc.txt');
    writeFileSync(file, 'abc');
    const rec = recordInput(file);
    expect(rec.name).toBe('abc.txt');
    expect(rec.sizeBytes).toBe(3);
    // SHA-256("abc") from FIPS 180-2, Appendix B.1 (the standard's own test vector).
    expect(rec.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(provenanceSnapshot().inputs).toHaveLength(1);
  });

  it('recordInput(same path, same bytes) twice keeps one record; changed bytes add one', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-prov-'));
    const file = join(dir, 'x.csv');
    writeFileSync(file, 'a,b\n1,2\n');
    recordInput(file);
    recordInput(file, new TextEncoder().encode('a,b\n1,2\n'));
    expect(provenanceSnapshot().inputs).toHaveLength(1);
    writeFileSync(file, 'a,b\n1,3\n');
    recordInput(file);
    expect(provenanceSnapshot().inputs).toHaveLength(2);
  });

  it('recordSeed keeps seeds in order, bigints as text, duplicates once', () => {
    recordSeed(42, 'simulate');
    recordSeed(42n, 'other');
    recordSeed(42, 'simulate');
    expect(provenanceSnapshot().seeds).toEqual([
      { seed: 42, label: 'simulate' },
      { seed: '42', label: 'other' },
    ]);
  });

  it('the registry is shared through globalThis, so a second module instance sees it', () => {
    recordSeed(7, 'a');
    const shared = (globalThis as unknown as Record<symbol, { seeds: unknown[] }>)[Symbol.for('sagitta.provenance')];
    expect(shared.seeds).toHaveLength(1);
  });

  it('recordCaution keeps each kind once; a range table records the stopping-power caution; reset forgets it', () => {
    expect(provenanceSnapshot().cautions).toEqual([]);
    recordCaution('stopping-power');
    recordCaution('stopping-power');
    expect(provenanceSnapshot().cautions).toEqual(['stopping-power']);
    resetProvenance();
    rangeTable(particle('proton'), material('water'), { fromMeV: 50, toMeV: 250, points: 5 });
    expect(provenanceSnapshot().cautions).toEqual(['stopping-power']);
  });
});
