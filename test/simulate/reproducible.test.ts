import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseHitsCsv } from '../../lib/io/index.js';
import { formatHitsCsv, formatTruthCsv, parseScenario, simulateChamber } from '../../lib/simulate/index.js';
import { DEMO_SEEDS, makeDemoFiles, schemaFile } from '../../notebooks/data/make-data.js';

const scenarioText = readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8');

describe('the simulator is seeded and reproducible', () => {
  it('same scenario and seed give identical hit and truth text; another seed gives different text', () => {
    const config = parseScenario(scenarioText);
    const small = { ...config, sources: config.sources.map((s) => ({ ...s, events: Math.min(s.events, 5) })) };
    const a = simulateChamber(small, 7), b = simulateChamber(small, 7), c = simulateChamber(small, 8);
    expect(formatHitsCsv(a)).toBe(formatHitsCsv(b));
    expect(formatTruthCsv(a)).toBe(formatTruthCsv(b));
    expect(formatHitsCsv(a)).not.toBe(formatHitsCsv(c));
  });

  it.each(Object.keys(DEMO_SEEDS))('notebooks/data: regenerating %s gives the committed bytes', (name) => {
    const files = makeDemoFiles(name);
    for (const [name, text] of Object.entries(files)) {
      // Compare digests: a failing string comparison of megabytes spends a minute printing the diff.
      const committed = readFileSync(new URL(`../../notebooks/data/${name}`, import.meta.url));
      const sha = (b: Uint8Array | string) => createHash('sha256').update(b).digest('hex');
      expect(sha(committed), `${name} differs from a regeneration; run npm run make-data`).toBe(sha(text));
    }
  });

  it('notebooks/data/scenario.schema.json is the schema the code validates with', () => {
    const [[name, text]] = Object.entries(schemaFile());
    expect(readFileSync(new URL(`../../notebooks/data/${name}`, import.meta.url), 'utf8')).toBe(text);
  });

  it('the demo hits file reads back through lib/io with the simulated rows, units and seed-stable values', () => {
    const bytes = readFileSync(new URL('../../notebooks/data/brindlemoor-hits.csv', import.meta.url));
    const table = parseHitsCsv(bytes, 'brindlemoor-hits.csv');
    const run = JSON.parse(readFileSync(new URL('../../notebooks/data/brindlemoor.run.json', import.meta.url), 'utf8'));
    expect(table.length).toBe(run.hitRows);
    expect(table.sigmaX![0]).toBeCloseTo(0.35e-3, 12);
    expect(table.sigmaZ![0]).toBeCloseTo(1.2e-3, 12);
    expect(bytes.byteLength).toBeLessThan(4_000_000);
  });
});
