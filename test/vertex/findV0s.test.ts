import { describe, expect, it } from 'vitest';
import { chamberMedium, VACUUM, type Medium } from '../../lib/matter/index.js';
import { KAON_SHORT, LAMBDA } from '../../lib/particles.js';
import { chamber, simulateChamber, type SimulationConfig, type SimulationResult } from '../../lib/simulate/index.js';
import { measureTracks } from '../../lib/track/index.js';
import { findV0s, vertexTracks, type V0FinderResult } from '../../lib/vertex/index.js';

const ORIGIN: [number, number, number] = [-0.55, 0, 0];

/** 300 K⁰_S (0.7 GeV/c) and 300 Λ (0.9 GeV/c) events from one point in a 1.5 T chamber, no multiple scattering. */
function run(medium: Medium, seed: number): SimulationResult {
  const config: SimulationConfig = {
    name: 'v0-pulls',
    chamber: chamber({ sizeM: [1.2, 0.8, 0.6], medium, fieldT: [0, 0, 1.5] }),
    transport: { energyLoss: medium === VACUUM ? 'off' : 'mean', scattering: false, maxStepM: 0.01, maxPathM: 3, deltaRayMinMeV: 0, decaysInFlight: false },
    measurement: { sampling: { kind: 'spacing', spacingM: 0.01 }, sigmaXM: 3e-4, sigmaYM: 3e-4, sigmaZM: 1e-3, efficiency: 1, noiseHitsPerEvent: 0 },
    sources: [
      { kind: 'beam', events: 300, species: [{ particle: KAON_SHORT, weight: 1 }], momentumGeV: 0.7, momentumSpread: 0.1, originM: ORIGIN, direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0.05 },
      { kind: 'beam', events: 300, species: [{ particle: LAMBDA, weight: 1 }], momentumGeV: 0.9, momentumSpread: 0.1, originM: ORIGIN, direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0.05 },
    ],
  };
  return simulateChamber(config, seed);
}

/** Candidate rows matched to the true decay vertex of their event: [row, x, y, z, isLambda]. */
function matched(sim: SimulationResult, found: V0FinderResult): number[][] {
  const t = sim.truth;
  const byEvent = new Map<number, number[]>();
  for (let i = 0; i < t.length; i++) if (t.species[i] === 'K0S' || t.species[i] === 'Lambda') byEvent.set(t.event[i], [t.ex[i], t.ey[i], t.ez[i], t.species[i] === 'Lambda' ? 1 : 0]);
  const c = found.candidates;
  const rows: number[][] = [];
  for (let i = 0; i < c.count; i++) {
    const v = byEvent.get(c.event[i]);
    if (v) rows.push([i, ...v]);
  }
  return rows;
}

const stats = (a: number[]) => {
  const mean = a.reduce((s, x) => s + x, 0) / a.length;
  return { n: a.length, mean, rms: Math.sqrt(a.reduce((s, x) => s + (x - mean) ** 2, 0) / a.length) };
};

/**
 * Simulated and measured samples, made once per test-file run by the first test that needs them.
 * The vertex room's own steps (vertexTracks, findV0s) run inside every test: code run at collection
 * or in beforeAll cannot be mutated, and a memoised find would be seen by the first test only
 * (test/mutation.md, "Static mutants").
 */
const samples = new Map<string, { sim: SimulationResult; measured: ReturnType<typeof measureTracks> }>();
function sample(medium: Medium, seed: number) {
  const key = `${medium.name}/${seed}`;
  let s = samples.get(key);
  if (!s) {
    const sim = run(medium, seed);
    s = { sim, measured: measureTracks(sim.hits, { fieldT: 1.5 }) };
    samples.set(key, s);
  }
  return s;
}
function vacuumFound() {
  const { sim, measured } = sample(VACUUM, 5);
  const found = findV0s(vertexTracks(measured), { primaryM: ORIGIN });
  return { found, rows: matched(sim, found) };
}

describe('findV0s on simulated K⁰_S and Λ decays (truth from the simulator; PDG 2022 masses)', () => {

  it('finds a candidate for most decays beyond the 2 cm flight cut, one per event, and counts the pairs it tried', () => {
    const { found, rows } = vacuumFound();
    expect(found.pairsTried).toBeGreaterThan(550);
    expect(rows.length).toBeGreaterThan(350);
    expect(found.candidates.count).toBe(rows.length);
    expect(found.rejected.flight + found.candidates.count).toBeLessThanOrEqual(found.pairsTried);
    expect(new Set(found.candidates.event).size).toBe(found.candidates.count);
  });

  it('vertex pulls (fit − truth)/σ in x, y, z have mean 0 ± 0.15 and rms 1 ± 0.15 (exact helices: the fit errors are the whole error)', () => {
    const { found, rows } = vacuumFound();
    const c = found.candidates;
    const pulls = [0, 1, 2].map((axis) => stats(rows.map(([i, ...v]) => ((axis === 0 ? c.xM : axis === 1 ? c.yM : c.zM)[i] - v[axis]) / Math.sqrt(c.cov[6 * i + [0, 3, 5][axis]]))));
    for (const p of pulls) {
      expect(p.n).toBe(rows.length);
      expect(Math.abs(p.mean)).toBeLessThan(0.15);
      expect(Math.abs(p.rms - 1)).toBeLessThan(0.15);
    }
  });

  it('mass pulls (m − m_PDG)/σ_m under ππ for K⁰_S and pπ⁻ for Λ: mean 0 ± 0.2, rms 1 ± 0.15', () => {
    const { found, rows } = vacuumFound();
    const c = found.candidates;
    const k = stats(rows.filter((r) => r[4] === 0).map(([i]) => (c.massPiPiMeV[i] - KAON_SHORT.massMeV) / c.sigmaMassPiPiMeV[i]));
    const l = stats(rows.filter((r) => r[4] === 1).map(([i]) => (c.massPPiMeV[i] - LAMBDA.massMeV) / c.sigmaMassPPiMeV[i]));
    for (const p of [k, l]) {
      expect(p.n).toBeGreaterThan(150);
      expect(Math.abs(p.mean)).toBeLessThan(0.2);
      expect(Math.abs(p.rms - 1)).toBeLessThan(0.15);
    }
  });

  it('Armenteros: Λ candidates have α > 0.35 (α₀ − 2p*/βM at 0.9 GeV/c is 0.40) and q_T ≤ 101 MeV/c; K⁰_S have |α| ≤ 1 and q_T ≤ 206 MeV/c (+3 MeV/c, about 3 σ of the measurement)', () => {
    const { found, rows } = vacuumFound();
    const c = found.candidates;
    let checked = 0;
    for (const [i, , , , isLambda] of rows) {
      if (isLambda) { expect(c.armenterosAlpha[i]).toBeGreaterThan(0.35); expect(c.armenterosQtMeV[i]).toBeLessThan(104); }
      else { expect(Math.abs(c.armenterosAlpha[i])).toBeLessThan(1.02); expect(c.armenterosQtMeV[i]).toBeLessThan(209); }
      checked++;
    }
    expect(checked).toBe(rows.length);
  });
});

describe('findV0s in liquid hydrogen: the energy lost between vertex and first hits', () => {
  const lh2 = chamberMedium('liquid-hydrogen');
  const peak = (sim: SimulationResult, found: V0FinderResult) => {
    const rows = matched(sim, found);
    const c = found.candidates;
    return {
      k: stats(rows.filter((r) => r[4] === 0).map(([i]) => c.massPiPiMeV[i])),
      l: stats(rows.filter((r) => r[4] === 1).map(([i]) => c.massPPiMeV[i])),
    };
  };
  it('without the correction the K⁰_S peak sits > 5 MeV and the Λ peak > 2.5 MeV low; with it within 2.5 MeV and 1 MeV of PDG', () => {
    const { sim, measured } = sample(lh2, 6);
    const tracks = vertexTracks(measured);
    const plain = peak(sim, findV0s(tracks, { primaryM: ORIGIN }));
    const corrected = peak(sim, findV0s(tracks, { primaryM: ORIGIN, medium: lh2 }));
    expect(plain.k.n).toBeGreaterThan(150);
    // PDG RPP 2022 literals (test/fixtures/pdg-particles): K⁰ 497.611 MeV, Λ 1115.683 MeV.
    expect(497.611 - plain.k.mean).toBeGreaterThan(5);
    expect(1115.683 - plain.l.mean).toBeGreaterThan(2.5);
    expect(Math.abs(corrected.k.mean - 497.611)).toBeLessThan(2.5);
    expect(Math.abs(corrected.l.mean - 1115.683)).toBeLessThan(1);
  });
});
