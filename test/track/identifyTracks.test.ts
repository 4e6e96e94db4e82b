import { readFileSync } from 'node:fs';
import { beforeEach, describe, expect, it } from 'vitest';
import { michelEndpoint } from '../../lib/analysis/michelEndpoint.js';
import { material } from '../../lib/matter/materials.js';
import { ELECTRON, MUON_PLUS, POSITRON } from '../../lib/particles.js';
import { resolveScenario } from '../../lib/simulate/scenario.js';
import { simulateChamber } from '../../lib/simulate/simulate.js';
import { identifyTrack } from '../../lib/track/identifyTrack.js';
import { identifyTracks, type IdentifiedTracks } from '../../lib/track/identifyTracks.js';
import { initialMomentumFromRange } from '../../lib/track/initialMomentumFromRange.js';
import { linkStopDecays } from '../../lib/track/linkStopDecays.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { meanHitSpacingM } from '../../lib/track/pathLength.js';
import { momentumAgainstResidualRange } from '../../lib/track/profileAlongTrack.js';
import { speciesRange } from '../../lib/track/speciesRange.js';
import { trackHits } from '../../lib/track/trackHits.js';

/**
 * Identification by range on simulated truth: the Hollowmere chamber of notebook 05 (liquid
 * propane, 2 T, a hit every 5 mm with 0.2 mm errors, tracks stopping 20–60 cm in) with every
 * source 2.7× larger and seed 7, so the sample is not the notebook's. Targets of issue 9: ≥ 95 %
 * of p and K, ≥ 90 % of π and μ, electron spirals as electrons. Reached (seed 7): p 161/162,
 * K 159/162, e 81/81, π 149/162 (92.0 %), μ 153/162 (94.4 %: μ⁺ 101/108, μ⁻ 52/54); seeds 8 and 9
 * gave π 91.4 / 92.6 %, μ 90.7 / 95.7 %, K 98.8 / 97.5 %. Every μ/π miss is a μ ↔ π swap: at equal range the two
 * masses' first-hit momenta differ by only 10–13 % (median), against the 5–6 % that scattering
 * leaves to the curvature of a 20–60 cm track here, so about one track in ten stays ambiguous.
 * The bending-plane filter alone reached π 88 %, μ 62–75 %; the rest comes from re-scoring
 * stopping tracks with the fit with material (see `identifyTrack`).
 */
const scenario = JSON.parse(readFileSync(new URL('../../notebooks/data/hollowmere.scenario.json', import.meta.url), 'utf8'));
for (const s of scenario.sources) s.events = Math.round(s.events * 2.7);
const mat = material('liquid-propane');
const volume = { min: [-0.8, -0.5, -0.3], max: [0.8, 0.5, 0.3] } as const;
// Simulated, measured and identified by the first test that asks (in a beforeEach, never at
// collection or in beforeAll): mutation testing switches a mutant on per test, so code run before
// the tests would never be mutated.
let sim: ReturnType<typeof simulateChamber>, tracks: ReturnType<typeof measureTracks>, ids: IdentifiedTracks, made = false;
const truthRow = new Map<string, number>();
beforeEach(() => {
  if (made) return;
  sim = simulateChamber(resolveScenario(scenario), 7);
  tracks = measureTracks(sim.hits, { fieldT: 2 });
  for (let i = 0; i < sim.truth.length; i++) truthRow.set(`${sim.truth.event[i]}/${sim.truth.track[i]}`, i);
  ids = identifyTracks(tracks, { fieldT: 2, material: mat, volume });
  made = true;
}, 120_000);
const trueOf = (k: number) => truthRow.get(`${tracks.event[k]}/${tracks.track[k]}`)!;

function efficiency(prefix: string): { right: number; total: number } {
  let right = 0, total = 0;
  for (let k = 0; k < tracks.count; k++) {
    const r = trueOf(k);
    if (sim.truth.process[r] !== 'stopping' || !sim.truth.species[r].startsWith(prefix)) continue;
    total++;
    if (ids.pid[k] === sim.truth.species[r]) right++;
  }
  return { right, total };
}

describe('identifyTracks on stopping tracks in liquid propane at 2 T (seed 7)', () => {
  it('names ≥ 95 % of stopping protons and K⁺ right (issue 9 target)', () => {
    for (const s of ['proton', 'K+']) {
      const e = efficiency(s);
      expect(e.total).toBe(162);
      expect(e.right / e.total).toBeGreaterThanOrEqual(0.95);
    }
  });
  it('names every electron spiral an electron (issue 9 target)', () => {
    const e = efficiency('electron');
    expect(e.total).toBe(81);
    expect(e.right).toBe(e.total);
  });
  it('names ≥ 90 % of stopping π and μ right (issue 9 target); every miss among them is a μ ↔ π swap', () => {
    const pi = efficiency('pi'), mu = efficiency('mu');
    expect(pi.total).toBe(162);
    expect(mu.total).toBe(162);
    expect(pi.right / pi.total).toBeGreaterThanOrEqual(0.9);
    expect(mu.right / mu.total).toBeGreaterThanOrEqual(0.9);
    for (let k = 0; k < tracks.count; k++) {
      const r = trueOf(k);
      const s = sim.truth.species[r];
      if (sim.truth.process[r] !== 'stopping' || !(s.startsWith('pi') || s.startsWith('mu')) || ids.pid[k] === s) continue;
      expect(ids.pid[k]).toMatch(/^(mu|pi)[+-]$/);
    }
  });
  it('gives first-hit momenta of stopping protons with a median bias below 1 % (hit truth)', () => {
    const rel: number[] = [];
    for (let k = 0; k < tracks.count; k++) {
      const r = trueOf(k);
      if (sim.truth.species[r] !== 'proton' || ids.pid[k] !== 'proton') continue;
      const pTrue = sim.hitTruth.momentumGeV[tracks.hitRows[tracks.offsets[k]]];
      rel.push(ids.pGeV[k] / pTrue - 1);
    }
    rel.sort((a, b) => a - b);
    expect(Math.abs(rel[rel.length >> 1])).toBeLessThan(0.01);
  });
  it('takes the turning sense from a circle fit when given: two displaced end hits flip the chords of a nearly straight track', () => {
    // κ = 0.22 /m over 0.39 m turns the track by 0.086 rad counter-clockwise; moving the first and
    // the last hit 2 mm down turns the first chord by +0.4 rad and the last by −0.4 rad.
    const x = Float64Array.from({ length: 78 }, (_, i) => -0.39 + 0.005 * i);
    const y = Float64Array.from(x, (v) => 0.5 * 0.22 * (v + 0.39) ** 2);
    y[0] -= 0.002; y[77] -= 0.002;
    const hits = { x, y, z: new Float64Array(78) };
    const o = { fieldT: 2, material: mat, volume, hitErrorM: 2e-4 };
    expect(identifyTrack(hits, o).charge).toBe(1); // chords: clockwise, so positive in +B
    expect(identifyTrack(hits, { ...o, turn: 1 }).charge).toBe(-1); // the fit's κ > 0: counter-clockwise, negative
  });
  it('leaves a straight high-momentum track that exits undecided, with a lower momentum bound', () => {
    // An arc of κ = 0.3 /m (p_T = 2 GeV/c at 2 T) with no curvature change, its last hit 0.5 mm inside the +x face.
    const x = Float64Array.from({ length: 60 }, (_, i) => -0.7 + 0.0255 * i);
    const y = Float64Array.from(x, (v) => 0.5 * 0.3 * (v + 0.7) ** 2);
    const id = identifyTrack({ x, y, z: new Float64Array(60) }, { fieldT: 2, material: mat, volume, hitErrorM: 2e-4 });
    expect(id.stop.stops).toBe(false);
    expect(id.pid).toBe('undecided');
    expect(id.pMinGeV).toBeGreaterThan(0.05);
  });
});

describe('decays at the stop: the Michel endpoint of electrons linked to stopped muons', () => {
  it('W from the linked electrons agrees with (m_μ² + m_e²)/(2 m_μ) = 52.830 MeV (PDG 2022 masses) within 2.5 σ, σ < 2 MeV', () => {
    const links = linkStopDecays(tracks, ids.stops);
    const eRange = speciesRange(POSITRON, mat);
    const energies: number[] = [];
    let wrong = 0;
    for (const d of links.daughters) {
      const s = links.parentRow[d];
      if (!ids.pid[s].startsWith('mu')) continue;
      const rd = trueOf(d), rs = trueOf(s);
      const grand = truthRow.get(`${sim.truth.event[rd]}/${sim.truth.parent[rd]}`);
      if (sim.truth.parent[rd] !== sim.truth.track[rs] && (grand === undefined || sim.truth.parent[grand] !== sim.truth.track[rs])) wrong++;
      const id = ids.identities[d];
      const p = ids.stops[d]
        ? initialMomentumFromRange(eRange, id.segments.pathM.at(-1)! + links.distanceM[d], meanHitSpacingM(id.segments.pathM)).pGeV
        : eRange.momentumGeV(eRange.rangeM(momentumAgainstResidualRange(id.segments, { fieldT: 2 }).pGeV[0]) + id.segments.pathMidM[0] + links.distanceM[d]);
      energies.push(Math.hypot(1000 * p, ELECTRON.massMeV));
    }
    expect(wrong).toBe(0);
    const w = (MUON_PLUS.massMeV ** 2 + ELECTRON.massMeV ** 2) / (2 * MUON_PLUS.massMeV);
    const m = michelEndpoint(energies, 10);
    expect(m.used).toBeGreaterThan(120);
    process.stdout.write(`Michel endpoint ${m.endpointMeV.toFixed(2)} ± ${m.sigmaMeV.toFixed(2)} MeV from ${m.used} electrons\n`);
    expect(m.sigmaMeV).toBeLessThan(2);
    expect(Math.abs(m.endpointMeV - w)).toBeLessThan(2.5 * m.sigmaMeV);
  });
  it('links only within distance: a track starting 3 cm from a stopped track\'s end is not its daughter', () => {
    const t = measureTracks({ ...sim.hits }, { fieldT: 2 });
    const far = linkStopDecays(t, ids.stops, { maxDistanceM: 1e-4 });
    expect(far.daughters.length).toBeLessThan(linkStopDecays(t, ids.stops).daughters.length);
    expect(trackHits(t, 0).x.length).toBe(t.nhits[0]);
  });
});
