import { describe, expect, it } from 'vitest';
import { fitTrackInMatter } from '../../lib/fit/matter/fitTrackInMatter.js';
import { fitTracksInMatter } from '../../lib/fit/matter/fitTracksInMatter.js';
import { matterSample } from '../../lib/fitlab/matterSample.js';
import { material } from '../../lib/matter/materials.js';
import { highlandTheta0, radiationLengthM } from '../../lib/matter/highland.js';
import { KAON_PLUS, MUON_MINUS, PION_PLUS, PROTON, type Particle } from '../../lib/particles.js';
import { curvatureSigmaEquallySpaced, glucksternCurvatureSigma, multipleScatteringCurvatureSigma } from '../../lib/track/resolution.js';

/** Hits on an exact circle of radius R through the origin heading +x, evenly spaced in arc over L. */
function arcHits(radiusM: number, lengthM: number, n: number): { x: Float64Array; y: Float64Array } {
  const x = new Float64Array(n), y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = (lengthM * i) / (n - 1) / radiusM;
    x[i] = radiusM * Math.sin(a); y[i] = radiusM * (1 - Math.cos(a));
  }
  return { x, y };
}

describe('fitTrackInMatter (issue 9: fit with material effects)', () => {
  it('no-scattering limit: σ(κ) equals the least-squares/Gluckstern curvature error for even spacing (Gluckstern, NIM 24 (1963) 381)', () => {
    const n = 40, L = 1, sigma = 2e-4;
    const h = arcHits(20, L, n);
    const f = fitTrackInMatter(h, { fieldT: 1, medium: material('liquid-hydrogen'), particle: MUON_MINUS, hitErrorM: sigma, multipleScattering: false, energyLoss: false });
    expect(f.status).toBe('ok');
    expect(Math.abs(f.first.kappa / (1 / 20) - 1)).toBeLessThan(1e-6); // exact hits: the circle itself
    const exact = curvatureSigmaEquallySpaced({ nPoints: n, sigmaM: sigma, lengthM: L });
    const gluckstern = glucksternCurvatureSigma({ nPoints: n, sigmaM: sigma, lengthM: L });
    // The exact parabola result differs from the asymptotic (N+4) form by < 1 % at N = 40.
    expect(Math.abs(f.first.sigmaKappa / exact - 1)).toBeLessThan(0.01);
    expect(Math.abs(f.first.sigmaKappa / gluckstern - 1)).toBeLessThan(0.02);
    expect(f.chi2).toBeLessThan(1e-6);
  });

  it('scattering-dominated limit: σ(κ) matches the Highland-based expression θ₀(L)/L (PDG RPP "Passage of particles through matter"), √(1/1.43) of the PDG detector-review term', () => {
    const n = 50, L = 1, p = 2;
    const h = arcHits(p / (0.299792458 * 1), L, n);
    const med = material('liquid-hydrogen');
    const f = fitTrackInMatter(h, { fieldT: 1, medium: med, particle: MUON_MINUS, hitErrorM: 1e-7, energyLoss: false });
    const beta = p / Math.hypot(p, MUON_MINUS.massMeV / 1000);
    const x0 = radiationLengthM(med);
    // With exactly measured positions the best curvature estimate is the change of direction over
    // L, so σ(κ) = θ₀(L)/L with θ₀ the Highland–Lynch–Dahl width for the whole length (our
    // derivation from the random walk of the direction; PDG RPP for θ₀).
    const theta0 = highlandTheta0({ momentumGeV: p, beta, charge: 1, thicknessOverX0: L / x0 });
    expect(Math.abs(f.first.sigmaKappa / (theta0 / L) - 1)).toBeLessThan(0.03);
    // The PDG detector-review term (Gluckstern C_N = 1.43, Highland without its log term) is for an
    // unweighted fit: the optimal fit is better by √(1/1.43) = 0.836, times the log term.
    const pdg = multipleScatteringCurvatureSigma({ momentumGeV: p, beta, lengthM: L, radiationLengthM: x0 }) * (1 + 0.038 * Math.log(L / x0 / (beta * beta)));
    expect(Math.abs(f.first.sigmaKappa / pdg / Math.sqrt(1 / 1.43) - 1)).toBeLessThan(0.03);
  });

  it('refuses gracefully: too few hits, a hypothesis that ranges out before the hits (status, no throw)', () => {
    const h = arcHits(0.5, 0.3, 30);
    const tiny = fitTrackInMatter({ x: h.x.subarray(0, 3), y: h.y.subarray(0, 3) }, { fieldT: 1, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 });
    expect(tiny.status).toBe('too-few-hits');
    // R = 0.5 m in 1 T is p_T = 150 MeV/c: a proton of that momentum stops within ~2 mm of propane.
    const f = fitTrackInMatter(h, { fieldT: 1, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 });
    expect(['cannot-reach', 'poor-fit', 'diverged']).toContain(f.status);
    expect(Number.isNaN(f.first.pGeV) || f.pValue < 1e-3).toBe(true);
  });
});

interface Case { readonly species: Particle; readonly medium: string; readonly p: readonly [number, number]; readonly tracks: number }

/**
 * Targets of issue 9 on simulated truth (lib/simulate through matterSample; seed 9; 2 T, a hit
 * every 5 mm of path, 200 µm errors, up to 50 hits, tan λ in ±0.3, mean loss, Highland
 * scattering): |median (p − p_true)/p_true| at the first hit < 0.3 % and pull rms in 0.9–1.1.
 * Each sample is large enough that the median is known to better than 0.1 % (σ_median =
 * 1.2533 σ/√n from the 16–84 % spread, asserted), so the 0.3 % bound tests the fit, not the
 * luck of one seed: scattering in propane leaves p to 5–10 % a track, so those cases need
 * 20 000 tracks (300 gave medians of −0.2 … +0.6 % from one seed to the next). Reached (seed 9):
 * μ⁻ LH2 +0.16 ± 0.05 %, π⁺ propane +0.20 ± 0.05 %, K⁺ argon −0.03 ± 0.05 %, p propane
 * +0.15 ± 0.07 %, μ⁻ argon +0.01 ± 0.04 %, p LH2 +0.09 ± 0.07 %; pull rms 0.965–1.03.
 */
const CASES: readonly Case[] = [
  { species: MUON_MINUS, medium: 'liquid-hydrogen', p: [0.05, 5], tracks: 4000 },
  { species: PION_PLUS, medium: 'liquid-propane', p: [0.05, 5], tracks: 20000 },
  { species: KAON_PLUS, medium: 'argon-gas', p: [0.05, 5], tracks: 3000 },
  { species: PROTON, medium: 'liquid-propane', p: [0.3, 5], tracks: 20000 },
  { species: MUON_MINUS, medium: 'argon-gas', p: [0.05, 5], tracks: 2000 },
  { species: PROTON, medium: 'liquid-hydrogen', p: [0.05, 5], tracks: 8000 },
];

describe('fitTracksInMatter on simulated truth (issue 9 targets)', () => {
  for (const c of CASES) {
    it(`${c.species.name} in ${c.medium}, ${c.p[0]}–${c.p[1]} GeV/c: median bias of p at the first hit and pull rms`, () => {
      const med = material(c.medium);
      const s = matterSample({ tracks: c.tracks, species: c.species, momentumGeV: c.p, material: med, fieldT: 2, spacingM: 5e-3, sigmaM: 2e-4, maxHits: 50, tanLambda: [-0.3, 0.3], seed: 9 });
      const f = fitTracksInMatter({ x: s.x, y: s.y, z: s.z, sigmaX: s.sigma, sigmaY: s.sigma, sigmaZ: s.sigma }, s.offsets, { fieldT: 2, medium: med, particle: c.species });
      const rel: number[] = [], pull: number[] = [];
      for (let k = 0; k < s.count; k++) {
        if (f.status[k] > 1) continue; // ok or poor-fit
        rel.push(f.pGeV[k] / s.pFirstGeV[k] - 1);
        pull.push((f.pGeV[k] - s.pFirstGeV[k]) / f.sigmaPGeV[k]);
      }
      rel.sort((a, b) => a - b);
      const median = rel[rel.length >> 1];
      const spread = 0.5 * (rel[Math.floor(0.84 * rel.length)] - rel[Math.floor(0.16 * rel.length)]);
      const sigmaMedian = (1.2533 * spread) / Math.sqrt(rel.length);
      const rms = Math.sqrt(pull.reduce((a, v) => a + v * v, 0) / pull.length);
      console.log(`${c.species.name} ${c.medium}: fitted ${rel.length}/${s.count}, median bias ${(100 * median).toFixed(3)} ± ${(100 * sigmaMedian).toFixed(3)} %, pull rms ${rms.toFixed(3)}`);
      expect(rel.length).toBeGreaterThan(0.95 * s.count);
      expect(sigmaMedian).toBeLessThan(0.001);
      expect(Math.abs(median)).toBeLessThan(0.003);
      expect(rms).toBeGreaterThan(0.9);
      expect(rms).toBeLessThan(1.1);
    });
  }
});

describe('fitTrackInMatter on loopers (tracks that turn more than once)', () => {
  // Muons of 50–100 MeV/c in argon gas at 2 T turn 1.2–2.4 times over 250 hits (R = 8–17 cm). The
  // start state must come from a leading stretch of the spiral: a circle through the first, middle
  // and last hits of a multi-turn track has no meaning, and the fit diverged or settled far off.
  it('μ in argon gas, 1.2–2.4 turns: fitted, median bias of p at the first hit < 0.3 %, pull rms 0.9–1.1', () => {
    const med = material('argon-gas');
    const s = matterSample({ tracks: 200, species: MUON_MINUS, momentumGeV: [0.05, 0.1], material: med, fieldT: 2, spacingM: 5e-3, sigmaM: 2e-4, maxHits: 250, tanLambda: [-0.1, 0.1], seed: 12 });
    const f = fitTracksInMatter({ x: s.x, y: s.y, z: s.z, sigmaX: s.sigma, sigmaY: s.sigma, sigmaZ: s.sigma }, s.offsets, { fieldT: 2, medium: med, particle: MUON_MINUS });
    const rel: number[] = [], pull: number[] = [];
    let turnsMin = Infinity, turnsMax = 0;
    for (let k = 0; k < s.count; k++) {
      const n = s.offsets[k + 1] - s.offsets[k];
      const turns = (n - 1) * 5e-3 * 0.299792458 * 2 / (2 * Math.PI * s.pFirstGeV[k]);
      turnsMin = Math.min(turnsMin, turns); turnsMax = Math.max(turnsMax, turns);
      if (f.status[k] > 1) continue;
      rel.push(f.pGeV[k] / s.pFirstGeV[k] - 1);
      pull.push((f.pGeV[k] - s.pFirstGeV[k]) / f.sigmaPGeV[k]);
    }
    rel.sort((a, b) => a - b);
    const rms = Math.sqrt(pull.reduce((a, v) => a + v * v, 0) / pull.length);
    console.log(`loopers: ${turnsMin.toFixed(2)}–${turnsMax.toFixed(2)} turns, fitted ${rel.length}/${s.count}, median bias ${(100 * rel[rel.length >> 1]).toFixed(3)} %, pull rms ${rms.toFixed(3)}`);
    expect(turnsMin).toBeGreaterThan(1);
    expect(rel.length).toBeGreaterThan(0.95 * s.count);
    expect(Math.abs(rel[rel.length >> 1])).toBeLessThan(0.003);
    expect(rms).toBeGreaterThan(0.9);
    expect(rms).toBeLessThan(1.1);
  });
});
