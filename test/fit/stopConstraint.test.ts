import { describe, expect, it } from 'vitest';
import { lossModel } from '../../lib/fit/matter/lossModel.js';
import { matterFitScratch } from '../../lib/fit/matter/matterFitScratch.js';
import { hitPathM, STOP_CONSTRAINT_SPACINGS, stopConstraint } from '../../lib/fit/matter/stopConstraint.js';
import { material } from '../../lib/matter/materials.js';
import { kineticEnergyFromRange } from '../../lib/matter/range.js';
import { rangeStragglingGcm2 } from '../../lib/matter/rangeStraggling.js';
import { massStoppingPower } from '../../lib/matter/stoppingPower.js';
import { ALPHA, ELECTRON, PROTON, type Particle } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';

/**
 * The stop constraint's pieces against numbers worked out here from its definition (fast; the
 * statistical checks on simulated stopping tracks are in matterFitStopping.test.ts): the hit it
 * is applied at, the residual range there from the path along the hits, the curvature that range
 * implies (checked range → energy through the integrating `kineticEnergyFromRange`, not the fit's
 * cached table) and its variance from the spacing and the range straggling.
 */
const PROPANE = material('liquid-propane');

/** 40 hits on a line along x, 4.7 and 5.3 mm apart in turn (z rising with tan λ = 0.3 unless planar), tiny errors. */
function line(planar = false) {
  const n = 40, x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  for (let i = 1; i < n; i++) { x[i] = x[i - 1] + (i % 2 ? 0.0047 : 0.0053); z[i] = 0.3 * x[i]; }
  return planar ? { x, y } : { x, y, z };
}

function expected(species: Particle, hits: ReturnType<typeof line>, kappaRef: number, tanLambda: number) {
  const n = hits.x.length;
  const sec = Math.sqrt(1 + tanLambda * tanLambda);
  // Path along the hits: 3-D chords, or bending-plane chords × sec λ (here both are dx·√1.09).
  const chord = (i: number) => (hits.x[i] - hits.x[i - 1]) * (hits.z ? Math.sqrt(1.09) : sec);
  let total = 0;
  for (let i = 1; i < n; i++) total += chord(i);
  const spacing = total / (n - 1);
  let c = n - 1, after = 0;
  while (c > 0 && after < STOP_CONSTRAINT_SPACINGS * spacing) { after += chord(c); c--; }
  const rho = PROPANE.densityGcm3 * 100;
  const rc = rho * (after + spacing / 2);
  const t = kineticEnergyFromRange(species, PROPANE, rc);
  const m = species.massMeV, p = Math.sqrt(t * (t + 2 * m)), beta = p / (t + m);
  const kappa = (Math.sign(kappaRef) * 0.299792458 * Math.abs(species.charge) * 2 * sec * 1000) / p;
  const s = massStoppingPower(species, PROPANE, t);
  const varR = (rho * spacing) ** 2 / 12 + rangeStragglingGcm2(species, PROPANE, t) ** 2;
  return { c, dk: kappa - kappaRef, v: ((kappa / p) * (s / beta)) ** 2 * varR };
}

describe('stopConstraint: the range–energy measurement of a track known to stop', () => {
  it.each([
    ['protons, 3-D hits', PROTON, false, -1.7],
    ['alphas (|z| = 2: the curvature of a momentum doubles)', ALPHA, false, 2.5],
    ['protons, bending-plane hits (path × sec λ)', PROTON, true, 0.9],
  ] as const)('%s: the hit 16 spacings before the end, κ(R) − κ_ref and its variance', (_, species, planar, kappaRef) => {
    const hits = line(planar);
    const n = hits.x.length, sc = matterFitScratch(n), model = lossModel(PROPANE, species);
    sc.kappa.fill(kappaRef);
    const tanLambda = 0.3;
    expect(stopConstraint(model, sc, hits, 1e-9, 2, tanLambda)).toBe(true);
    const e = expected(species, hits, kappaRef, tanLambda);
    expect(e.c).toBeGreaterThanOrEqual(n - 1 - 17);
    expect(e.c).toBeLessThanOrEqual(n - 1 - 16);
    expect(sc.stop[0]).toBe(e.c);
    expect(sc.stop[1] / e.dk - 1).toBeCloseTo(0, 4);
    expect(sc.stop[2] / e.v - 1).toBeCloseTo(0, 3);
  });
  it('on a track shorter than 16 spacings it is applied at the first hit; an e± hypothesis gets none', () => {
    const full = line();
    const hits = { x: full.x.subarray(0, 10), y: full.y.subarray(0, 10), z: full.z!.subarray(0, 10) };
    const sc = matterFitScratch(10);
    sc.kappa.fill(1);
    expect(stopConstraint(lossModel(PROPANE, PROTON), sc, hits, 1e-9, 2, 0.3)).toBe(true);
    expect(sc.stop[0]).toBe(0);
    sc.stop.fill(7);
    expect(stopConstraint(lossModel(PROPANE, ELECTRON), sc, hits, 1e-9, 2, 0.3)).toBe(false);
    expect(Array.from(sc.stop)).toEqual([7, 7, 7]);
  });
  it('needs two distinct hits: two hits make one; hits all at one point (no path, no range) or one hit make none', () => {
    const model = lossModel(PROPANE, PROTON);
    const two = { x: Float64Array.of(0, 0.005), y: new Float64Array(2), z: new Float64Array(2) };
    const sc = matterFitScratch(2);
    sc.kappa.fill(1);
    expect(stopConstraint(model, sc, two, 1e-9, 2, 0)).toBe(true);
    expect(sc.stop[0]).toBe(0);
    expect(sc.stop[2]).toBeGreaterThan(0);
    for (const n of [1, 5]) {
      const same = { x: new Float64Array(n).fill(0.01), y: new Float64Array(n), z: new Float64Array(n) };
      const s2 = matterFitScratch(n);
      s2.kappa.fill(1);
      s2.stop.fill(7);
      expect(stopConstraint(model, s2, same, 1e-9, 2, 0), `${n} hit(s) at one point`).toBe(false);
      expect(Array.from(s2.stop)).toEqual([7, 7, 7]);
    }
  });
});

describe('hitPathM: path along the hits with the chord excess of the hit errors removed', () => {
  it('exact hits on a line: the chord sum; 3-D and bending-plane × sec λ agree', () => {
    const n = 11, x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
    for (let i = 0; i < n; i++) { x[i] = 0.003 * i; y[i] = 0.004 * i; z[i] = 0.0025 * i; }
    const sigma = new Float64Array(n); // error-free: nothing to remove
    expect(hitPathM({ x, y, z, sigmaX: sigma, sigmaY: sigma, sigmaZ: sigma }, NaN, 0)).toBeCloseTo(10 * Math.hypot(0.003, 0.004, 0.0025), 15);
    // Bending plane only: chords of 5 mm times sec λ with tan λ = 0.0025/0.005.
    expect(hitPathM({ x, y, sigmaX: sigma, sigmaY: sigma }, NaN, 0.5)).toBeCloseTo(10 * 0.005 * Math.sqrt(1.25), 15);
    // A hit given twice adds nothing (a zero chord has no direction to be across).
    const twice = (a: Float64Array) => Float64Array.from([...a.subarray(0, 4), a[3], ...a.subarray(4)]);
    const s4 = new Float64Array(n + 1).fill(1e-4);
    expect(hitPathM({ x: twice(x), y: twice(y), z: twice(z), sigmaX: s4, sigmaY: s4, sigmaZ: s4 }, NaN, 0)).toBeCloseTo(hitPathM({ x, y, z, sigmaX: s4.subarray(1), sigmaY: s4.subarray(1), sigmaZ: s4.subarray(1) }, NaN, 0), 15);
    // From and to: the path of a stretch.
    expect(hitPathM({ x, y, z, sigmaX: sigma, sigmaY: sigma, sigmaZ: sigma }, NaN, 0, 3, 7)).toBeCloseTo(4 * Math.hypot(0.003, 0.004, 0.0025), 15);
  });
  it('per-axis hit errors: the excess removed is the variance across each chord, (V⊥ᵢ + V⊥ᵢ₊₁)/(2ℓ), V⊥ = Σ σ²(1 − u²) over the axes', () => {
    // Two chords in general directions, each hit with its own σx, σy, σz (numbers chosen here).
    const x = Float64Array.of(0, 0.003, 0.004), y = Float64Array.of(0, 0.004, 0.009), z = Float64Array.of(0, 0.0012, 0.0005);
    const sx = Float64Array.of(1e-4, 2e-4, 3e-4), sy = Float64Array.of(4e-4, 1e-4, 2e-4), sz = Float64Array.of(3e-4, 5e-4, 1e-4);
    let want = 0, wantPlanar = 0;
    for (let i = 1; i < 3; i++) {
      const d = [x[i] - x[i - 1], y[i] - y[i - 1], z[i] - z[i - 1]];
      const l = Math.hypot(d[0], d[1], d[2]), u2 = d.map((c) => (c / l) ** 2);
      const across = (j: number) => sx[j] ** 2 * (1 - u2[0]) + sy[j] ** 2 * (1 - u2[1]) + sz[j] ** 2 * (1 - u2[2]);
      want += l - (across(i - 1) + across(i)) / (2 * l);
      const lp = Math.hypot(d[0], d[1]), up = [(d[0] / lp) ** 2, (d[1] / lp) ** 2];
      const acrossP = (j: number) => sx[j] ** 2 * (1 - up[0]) + sy[j] ** 2 * (1 - up[1]);
      wantPlanar += lp - (acrossP(i - 1) + acrossP(i)) / (2 * lp);
    }
    expect(hitPathM({ x, y, z, sigmaX: sx, sigmaY: sy, sigmaZ: sz }, NaN, 0)).toBeCloseTo(want, 15);
    expect(hitPathM({ x, y, sigmaX: sx, sigmaY: sy }, NaN, 0.2)).toBeCloseTo(wantPlanar * Math.sqrt(1.04), 15);
    // Without error columns every axis takes hitErrorM; without sigmaY or sigmaZ they take sigmaX.
    const e = 3e-4, ex = new Float64Array(3).fill(e);
    expect(hitPathM({ x, y, z }, e, 0)).toBeCloseTo(hitPathM({ x, y, z, sigmaX: ex, sigmaY: ex, sigmaZ: ex }, NaN, 0), 16);
    expect(hitPathM({ x, y, z, sigmaX: ex }, NaN, 0)).toBeCloseTo(hitPathM({ x, y, z }, e, 0), 16);
  });
  it('noisy hits (200 µm on 5 mm chords): the raw chord sum is 2σ²/ℓ long per chord, the corrected one is not', () => {
    const rng = seededRandom(3, 'hitPath');
    const n = 51, sigmaM = 2e-4, trials = 2000, truth = 0.25;
    let raw = 0, corrected = 0;
    const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
    for (let t = 0; t < trials; t++) {
      for (let i = 0; i < n; i++) { x[i] = 0.005 * i + sigmaM * rng.gaussian(); y[i] = sigmaM * rng.gaussian(); z[i] = sigmaM * rng.gaussian(); }
      corrected += hitPathM({ x, y, z }, sigmaM, 0);
      let s = 0;
      for (let i = 1; i < n; i++) s += Math.hypot(x[i] - x[i - 1], y[i] - y[i - 1], z[i] - z[i - 1]);
      raw += s;
    }
    // 50 chords × 2σ²/ℓ = 50 × 2 × 4e-8 / 5e-3 = 0.8 mm; each trial's sum scatters by ≈ σ√2 = 0.28 mm (6 µm over 2 000).
    expect(raw / trials - truth).toBeCloseTo(8e-4, 4);
    expect(Math.abs(corrected / trials - truth)).toBeLessThan(3e-5);
  });
});
