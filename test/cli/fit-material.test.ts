import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runFit, type FitCommandOptions } from '../../kernel/cli/commands/fit.js';
import { momentumResolution } from '../../lib/track/resolution.js';
import { material } from '../../lib/matter/materials.js';
import { PION_PLUS } from '../../lib/particles.js';

const dir = mkdtempSync(join(tmpdir(), 'sagitta-fit-material-'));

/** One positive track: R = 2 m, 25 hits over 0.5 rad of arc, 150 µm errors, in metres. */
function writeHits(): string {
  const lines = ['event,track,x[m],y[m],sigma[um]'];
  for (let i = 0; i < 25; i++) {
    const a = Math.PI / 2 - (0.5 * i) / 24;
    lines.push(`1,1,${2 * Math.cos(a)},${-2 + 2 * Math.sin(a)},150`);
  }
  const p = join(dir, 'hits.csv');
  writeFileSync(p, lines.join('\n') + '\n');
  return p;
}

const base: FitCommandOptions = { field: '1.5 T', fitter: 'geometric', lengthUnit: 'm', chargeNumber: '1' };

describe('sagitta fit --material (issue 3: momentum error budget)', () => {
  const hits = writeHits();
  it('adds sigma_p_meas_GeV_c, sigma_p_ms_GeV_c and sigma_p_total_GeV_c; the MS term matches momentumResolution for argon gas', async () => {
    const out = join(dir, 'tracks.json');
    // The plain helix fit here: its σ(pT) is the hit-error term alone (the fit with material adds scattering, tested below).
    const summary = await runFit(hits, { ...base, material: 'argon-gas', particle: 'pi+', plainHelix: true, out });
    const row = JSON.parse(readFileSync(out, 'utf8')).tracks[0];
    expect(row).toHaveProperty('sigma_p_meas_GeV_c');
    expect(row).toHaveProperty('sigma_p_ms_GeV_c');
    const p = row.pt_GeV_c as number;
    const chord = 2 * 2 * Math.sin(0.25);
    const r = momentumResolution({ momentumGeV: p, beta: p / Math.hypot(p, PION_PLUS.massMeV / 1000), fieldT: 1.5, lengthM: chord, sigmaM: 1.5e-4, nPoints: 25, material: material('argon-gas') });
    expect(Math.abs(row.sigma_p_ms_GeV_c / (p * r.multipleScattering) - 1)).toBeLessThan(1e-3); // 4 significant digits in the file
    expect(Math.abs(row.sigma_p_total_GeV_c / Math.hypot(row.sigma_p_meas_GeV_c, row.sigma_p_ms_GeV_c) - 1)).toBeLessThan(1e-3);
    // The measurement term is the exact least-squares error for these hits: close to the fit's own σ(pT).
    expect(Math.abs(row.sigma_p_meas_GeV_c / row.sigma_pt_GeV_c - 1)).toBeLessThan(0.05);
    expect(summary).toMatch(/error budget in argon-gas \(β from pi\+\): median σp\/p measurement [\d.]+ %, multiple scattering [\d.]+ %/);
  });
  it('with the fit with material, sigma_pt_GeV_c holds the scattering: it agrees with the budget total', async () => {
    const out = join(dir, 'matter.json');
    const summary = await runFit(hits, { ...base, material: 'argon-gas', particle: 'pi+', out });
    const row = JSON.parse(readFileSync(out, 'utf8')).tracks[0];
    expect(summary).toMatch(/fit with material: energy loss of pi\+ and multiple scattering in argon-gas/);
    expect(Math.abs(row.sigma_pt_GeV_c / row.sigma_p_total_GeV_c - 1)).toBeLessThan(0.2);
  });
  it('the fit with material gives the same bytes with 1 and 2 threads; --plain-helix keeps the one-helix fit; poor fits are counted', async () => {
    const demo = fileURLToPath(new URL('../../notebooks/data/brindlemoor-hits.csv', import.meta.url));
    const one = join(dir, 'one.csv'), two = join(dir, 'two.csv'), plain = join(dir, 'plain-helix.csv');
    const o = { ...base, field: '1.5 T', lengthUnit: 'mm', material: 'liquid-hydrogen', particle: 'mu+', quiet: true };
    const summary = await runFit(demo, { ...o, threads: '1', out: one });
    await runFit(demo, { ...o, threads: '2', out: two });
    expect(readFileSync(two)).toEqual(readFileSync(one));
    expect(summary).toMatch(/fitted \d+ \(\d+ poor fits: chi2 probability below 0\.001\), failed \d+/);
    await runFit(demo, { ...o, plainHelix: true, out: plain });
    const header = readFileSync(plain, 'utf8').split('\n')[0];
    expect(header).toMatch(/chi2_prob/);
    expect(header).not.toMatch(/p_last_GeV_c/);
    expect(readFileSync(one, 'utf8').split('\n')[0]).toMatch(/p_last_GeV_c/);
  });
  it('without --material the columns are absent', async () => {
    const out = join(dir, 'plain.csv');
    await runFit(hits, { ...base, out });
    expect(readFileSync(out, 'utf8').split('\n')[0]).not.toMatch(/sigma_p_meas_GeV_c/);
  });
  it('an unknown material is a located, listed error', async () => {
    await expect(runFit(hits, { ...base, material: 'cheese', out: join(dir, 'x.csv') })).rejects.toThrow(/unknown material "cheese"/);
  });
});
