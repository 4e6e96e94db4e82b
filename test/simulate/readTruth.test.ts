import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { formatTruthCsv, parseScenario, simulateChamber } from '../../lib/simulate/index.js';
import { readTruth } from '../../lib/simulate/readTruth.js';
import { provenanceSnapshot } from '../../lib/provenance.js';

const dir = mkdtempSync(join(tmpdir(), 'sagitta-truth-'));

describe('readTruth', () => {
  it('gives back the simulator\'s truth table (to the file\'s 0.1 µm / 0.1 keV/c rounding) and records the file', () => {
    const config = parseScenario(readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8'));
    const small = { ...config, sources: config.sources.map((s) => ({ ...s, events: Math.min(s.events, 4) })) };
    const result = simulateChamber(small, 11);
    const file = join(dir, 'truth.csv');
    writeFileSync(file, formatTruthCsv(result));
    const back = readTruth(file);
    const t = result.truth;
    expect(back.length).toBe(t.length);
    expect(back.species).toEqual(t.species);
    expect(back.process).toEqual(t.process);
    expect(back.end).toEqual(t.end);
    for (const key of ['vx', 'vy', 'vz', 'ex', 'ey', 'ez', 'pathM', 'px', 'py', 'pz'] as const) {
      for (let i = 0; i < t.length; i++) expect(Math.abs(back[key][i] - t[key][i])).toBeLessThanOrEqual(5.1e-8);
    }
    expect(Array.from(back.charge)).toEqual(Array.from(t.charge));
    expect(provenanceSnapshot().inputs.some((r) => r.name === 'truth.csv' && /^[0-9a-f]{64}$/.test(r.sha256))).toBe(true);
  });

  it('refuses a file that is not a truth file, naming the line', () => {
    const bad = join(dir, 't.csv');
    writeFileSync(bad, 'event,track,x,y\n1,1,2,3\n');
    expect(() => readTruth(bad)).toThrow(/t\.csv:1: not a truth file/);
  });
});
