import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { fitTrackInMatter } from '../../lib/fit/matter/fitTrackInMatter.js';
import { fitTracksInMatter } from '../../lib/fit/matter/fitTracksInMatter.js';
import { matterSample } from '../../lib/fitlab/matterSample.js';
import { writeFileAtomic } from '../../lib/io/writeFileAtomic.js';
import { material } from '../../lib/matter/materials.js';
import { ALPHA, ELECTRON, MUON_MINUS, PION_PLUS, PROTON, type Particle } from '../../lib/particles.js';
import { goldenUpdateRequested } from '../expectGolden.js';

/**
 * A regression record of the fit with material, not a physics check (those are in
 * matterFit*.test.ts against Gluckstern, Highland and simulated truth): small simulated samples
 * in each regime the fit has — slowing and stopping protons (the reach limit, the range profile at
 * the wall), protons leaving just before their range end, muons in liquid hydrogen, pions in argon,
 * electron spirals (bremsstrahlung noise), a mass that cannot reach the hits, alphas (|z| = 2), hits out of order, an iteration cap, the fit without scattering or without loss, and the stop constraint (on stopping tracks, and on tracks wrongly taken to stop, without z) — with
 * every reported number compared against the recorded one to 1e-7 relative. Its job is to catch a
 * change nobody meant, quickly: the statistical tests need 10⁴ tracks and half a minute each, too
 * slow for mutation testing (test/mutation.md), while this file runs in about a second. A
 * deliberate change of the fit's numbers is recorded anew with
 * `npm run update-golden -- test/fit/matterFitRecord.test.ts` and the diff reviewed.
 */
const RECORD = fileURLToPath(new URL('./golden/matterFit-record.json', import.meta.url));
const RELATIVE = 1e-7;

interface Case { readonly name: string; readonly species: Particle; readonly medium: string; readonly p: readonly [number, number]; readonly maxHits: number; readonly fitAs?: Particle; readonly scramble?: boolean; readonly straggling?: boolean; readonly stopping?: 'truth' | 'all'; readonly options?: { multipleScattering?: boolean; energyLoss?: boolean; maxIterations?: number } }
const CASES: readonly Case[] = [
  { name: 'protons stopping in propane', species: PROTON, medium: 'liquid-propane', p: [0.3, 0.5], maxHits: 60 },
  { name: 'protons leaving near their range end', species: PROTON, medium: 'liquid-propane', p: [0.45, 0.62], maxHits: 50 },
  { name: 'muons in liquid hydrogen', species: MUON_MINUS, medium: 'liquid-hydrogen', p: [0.05, 2], maxHits: 50 },
  { name: 'pions in argon gas', species: PION_PLUS, medium: 'argon-gas', p: [0.1, 3], maxHits: 40 },
  { name: 'electrons in propane', species: ELECTRON, medium: 'liquid-propane', p: [0.02, 0.3], maxHits: 50 },
  { name: 'pions in propane, no scattering noise', species: PION_PLUS, medium: 'liquid-propane', p: [0.2, 2], maxHits: 50, options: { multipleScattering: false } },
  { name: 'slowing muons fitted as protons (some cannot reach)', species: MUON_MINUS, medium: 'liquid-propane', p: [0.08, 0.3], maxHits: 60, fitAs: PROTON },
  { name: 'alphas in argon gas (|z| = 2)', species: ALPHA, medium: 'argon-gas', p: [0.4, 1.2], maxHits: 50 },
  { name: 'stopping protons, at most two iterations', species: PROTON, medium: 'liquid-propane', p: [0.3, 0.5], maxHits: 60, options: { maxIterations: 2 } },
  { name: 'muons with their hits out of order (the fit steps back along the helix)', species: MUON_MINUS, medium: 'liquid-propane', p: [0.1, 0.4], maxHits: 40, scramble: true },
  { name: 'pions in propane, no energy loss', species: PION_PLUS, medium: 'liquid-propane', p: [0.5, 5], maxHits: 50, options: { energyLoss: false } },
  { name: 'stopping pions with the stop constraint (straggling simulated)', species: PION_PLUS, medium: 'liquid-propane', p: [0.05, 0.3], maxHits: 60, straggling: true, stopping: 'truth' },
  { name: 'protons taken to stop, stopping or not (2-D hits: no z)', species: PROTON, medium: 'liquid-propane', p: [0.2, 0.6], maxHits: 40, straggling: true, stopping: 'all' },
];

type Record = { [name: string]: { [column: string]: (number | string)[] } };

/** Every reported column of each case's fit (24 tracks a case, seed 4), numbers to 12 significant digits. */
function measure(): Record {
  const out: Record = {};
  for (const c of CASES) {
    const med = material(c.medium);
    const s = matterSample({ tracks: 24, species: c.species, momentumGeV: c.p, material: med, fieldT: 2, spacingM: 5e-3, sigmaM: 2e-4, maxHits: c.maxHits, tanLambda: [-0.3, 0.3], seed: 4, ...(c.straggling ? { energyLoss: 'straggling' as const } : {}) });
    const planar = c.stopping === 'all';
    const hits = planar ? { x: s.x, y: s.y, sigmaX: s.sigma, sigmaY: s.sigma } : { x: s.x, y: s.y, z: s.z, sigmaX: s.sigma, sigmaY: s.sigma, sigmaZ: s.sigma };
    const stopping = c.stopping === 'truth' ? s.stopped : c.stopping === 'all' ? new Uint8Array(s.count).fill(1) : undefined;
    if (c.scramble) {
      // Swap hits i and n−1−i for every other i of each track: a path that doubles back.
      for (let k = 0; k < s.count; k++) {
        const a = s.offsets[k], n = s.offsets[k + 1] - a;
        for (let i = 1; i < n >> 1; i += 2) for (const col of [s.x, s.y, s.z]) { const t = col[a + i]; col[a + i] = col[a + n - 1 - i]; col[a + n - 1 - i] = t; }
      }
    }
    const f = fitTracksInMatter(hits, s.offsets, { fieldT: 2, medium: med, particle: c.fitAs ?? c.species, ...c.options, ...(stopping ? { stoppingTracks: stopping } : {}) });
    const num = (a: ArrayLike<number>) => Array.from(a, (v) => (Number.isFinite(v) ? Number(v.toPrecision(12)) : String(v)));
    const row: { [column: string]: (number | string)[] } = {
      status: Array.from(f.status), p: num(f.pGeV), sigmaP: num(f.sigmaPGeV), kappa: num(f.kappa), sigmaKappa: num(f.sigmaKappa),
      phi: num(f.phi), tanLambda: num(f.tanLambda), x: num(f.xM), y: num(f.yM), z: num(f.zM), pLast: num(f.pLastGeV), sigmaPLast: num(f.sigmaPLastGeV),
      chi2: num(f.chi2), ndf: num(f.ndf), pValue: num(f.pValue), path: num(f.pathLengthM), residualRange: num(f.residualRangeM),
      reachedHits: num(f.reachedHits), iterations: num(f.iterations), firstCov: num(f.firstCov),
      ...(stopping ? { stopChi2: num(f.stopChi2) } : {}),
    };
    // The single-track path with its smoothed residuals, on the first track (the first one taken to stop, with the constraint).
    const k0 = stopping ? Math.max(0, stopping.indexOf(1)) : 0, a = s.offsets[k0], b = s.offsets[k0 + 1];
    const view = planar
      ? { x: s.x.subarray(a, b), y: s.y.subarray(a, b), sigmaX: s.sigma.subarray(a, b), sigmaY: s.sigma.subarray(a, b) }
      : { x: s.x.subarray(a, b), y: s.y.subarray(a, b), z: s.z.subarray(a, b), sigmaX: s.sigma.subarray(a, b), sigmaY: s.sigma.subarray(a, b), sigmaZ: s.sigma.subarray(a, b) };
    const one = fitTrackInMatter(view, { fieldT: 2, medium: med, particle: c.fitAs ?? c.species, ...c.options, stops: stopping !== undefined && stopping[k0] === 1 });
    row.firstTrackResiduals = num(one.residualM);
    row.firstTrackResidualsZ = num(one.residualZM);
    row.firstTrackLast = num([one.last.pGeV, one.last.sigmaPGeV, one.last.kappa, one.last.xM, one.last.yM, one.last.zM, ...one.last.cov]);
    out[c.name] = row;
  }
  return out;
}

describe('fit with material: regression record (closure with this code, not a physics check)', () => {
  it('reproduces every recorded number of thirteen small samples to 1e-7 relative', () => {
    const now = measure();
    if (goldenUpdateRequested()) {
      writeFileAtomic(RECORD, `${JSON.stringify(now, null, 1)}\n`);
      return;
    }
    if (!existsSync(RECORD)) throw new Error('test/fit/golden/matterFit-record.json is missing; record it deliberately with npm run update-golden -- test/fit/matterFitRecord.test.ts');
    const was: Record = JSON.parse(readFileSync(RECORD, 'utf8'));
    expect(Object.keys(now)).toEqual(Object.keys(was));
    let compared = 0;
    for (const [name, columns] of Object.entries(was)) {
      expect(Object.keys(now[name])).toEqual(Object.keys(columns));
      for (const [column, values] of Object.entries(columns)) {
        const got = now[name][column];
        expect(got.length, `${name}: ${column}`).toBe(values.length);
        values.forEach((v, i) => {
          const g = got[i];
          if (typeof v === 'number' && typeof g === 'number') {
            if (Math.abs(g - v) > RELATIVE * Math.max(Math.abs(v), 1e-12)) expect(g, `${name}: ${column}[${i}]`).toBe(v);
          } else expect(g, `${name}: ${column}[${i}]`).toBe(v);
          compared++;
        });
      }
    }
    expect(compared).toBeGreaterThan(5000);
  });
});
