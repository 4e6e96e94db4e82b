import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { VACUUM } from '../../lib/matter/index.js';
import { KAON_SHORT } from '../../lib/particles.js';
import { chamber, formatHitsCsv, simulateChamber, type SimulationConfig } from '../../lib/simulate/index.js';

const BIN = fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'sagitta-vertices-'));

function sagitta(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', cwd: dir });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** 40 K⁰_S events of 0.7 GeV/c from (−55, 0, 0) cm in a 1.5 T vacuum chamber, written as the simulator writes hit files (mm). */
function writeHits(): string {
  const config: SimulationConfig = {
    name: 'cli-v0',
    chamber: chamber({ sizeM: [1.2, 0.8, 0.6], medium: VACUUM, fieldT: [0, 0, 1.5] }),
    transport: { energyLoss: 'off', scattering: false, maxStepM: 0.01, maxPathM: 3, deltaRayMinMeV: 0, decaysInFlight: false },
    measurement: { sampling: { kind: 'spacing', spacingM: 0.01 }, sigmaXM: 3e-4, sigmaYM: 3e-4, sigmaZM: 1e-3, efficiency: 1, noiseHitsPerEvent: 1 },
    sources: [{ kind: 'beam', events: 40, species: [{ particle: KAON_SHORT, weight: 1 }], momentumGeV: 0.7, momentumSpread: 0.1, originM: [-0.55, 0, 0], direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0.05 }],
  };
  const p = join(dir, 'v0-hits.csv');
  writeFileSync(p, formatHitsCsv(simulateChamber(config, 3)));
  return p;
}

const CONTRACT = ['event', 'track_pos', 'track_neg', 'x_m', 'y_m', 'z_m', 'dca_m', 'flight_m', 'mass_pipi_MeV', 'sigma_mass_pipi_MeV',
  'mass_ppi_MeV', 'sigma_mass_ppi_MeV', 'mass_pip_MeV', 'sigma_mass_pip_MeV', 'armenteros_alpha', 'armenteros_qt_MeV', 'status'];

describe('sagitta vertices', () => {
  const hits = writeHits();

  it('writes one row per candidate with the contract columns in order, K⁰_S masses near 497.6 MeV, and a summary of pairs tried and candidates found', () => {
    const r = sagitta('vertices', hits, '--field', '15 kG', '--primary', '-55 0 0 cm', '--out', 'v0.csv');
    expect(r.code).toBe(0);
    const rows = readFileSync(join(dir, 'v0.csv'), 'utf8').trim().split('\n').map((l) => l.split(','));
    const header = rows.shift()!;
    expect(header.filter((h) => CONTRACT.includes(h))).toEqual(CONTRACT);
    expect(header[header.length - 1]).toBe('status');
    expect(rows.length).toBeGreaterThan(20);
    const masses = rows.map((row) => Number(row[header.indexOf('mass_pipi_MeV')])).sort((a, b) => a - b);
    expect(Math.abs(masses[masses.length >> 1] - 497.611)).toBeLessThan(2); // PDG RPP 2022 K⁰ mass (literal)
    expect(r.stderr).toMatch(/\d+ opposite-charge pairs tried, \d+ candidates found/);
    expect(r.stderr).toContain(`${rows.length} candidates found`);
    expect(r.stderr).toContain('unassigned hits (track < 0) set aside');
  });

  it('JSON output carries the run description and the counts', () => {
    expect(sagitta('vertices', hits, '--field', '1.5 T', '--primary', '-0.55 m 0 m 0 m', '--out', 'v0.json').code).toBe(0);
    const doc = JSON.parse(readFileSync(join(dir, 'v0.json'), 'utf8'));
    expect(doc.meta.primary_m).toEqual([-0.55, 0, 0]);
    expect(doc.meta.counts.candidates).toBeGreaterThan(20);
    expect(doc.meta.counts.pairs_tried).toBeGreaterThanOrEqual(doc.meta.counts.candidates);
  });

  it('bad usage exits 2 naming the option; an unusable input exits 1 naming file and line, as sagitta fit does', () => {
    const bare = sagitta('vertices', hits, '--field', '1.5 T', '--primary', '-55 0 0');
    expect(bare.code).toBe(2);
    expect(bare.stderr).toContain('--primary');
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'event,track,x,y\n1,1,0,0\n1,1,abc,1\n');
    const r = sagitta('vertices', bad, '--field', '1.5 T');
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('bad.csv:3');
  });
});
