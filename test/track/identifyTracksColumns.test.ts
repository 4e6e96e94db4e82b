import { readFileSync } from 'node:fs';
import { beforeEach, describe, expect, it } from 'vitest';
import { material } from '../../lib/matter/materials.js';
import { resolveScenario } from '../../lib/simulate/scenario.js';
import { simulateChamber } from '../../lib/simulate/simulate.js';
import { identifyTracks, type IdentifiedTracks } from '../../lib/track/identifyTracks.js';
import { measureTracks, type TrackTable } from '../../lib/track/measureTracks.js';

/**
 * The columns of `identifyTracks` against the per-track results they are made from, on a small
 * simulated Hollowmere sample (a tenth of the notebook's sources, seed 3). Closure of the table
 * plumbing (no physics source): each column row by row, names and objects alike, and the
 * turning sense taken from the circle fit's κ.
 */
const scenario = JSON.parse(readFileSync(new URL('../../notebooks/data/hollowmere.scenario.json', import.meta.url), 'utf8'));
for (const s of scenario.sources) s.events = Math.max(2, Math.round(s.events / 10));
const volume = { min: [-0.8, -0.5, -0.3], max: [0.8, 0.5, 0.3] } as const;
let tracks: TrackTable, byName: IdentifiedTracks, byObject: IdentifiedTracks, made = false;
/**
 * The sample, made by the first test that asks (not in a hook or at collection: mutation testing
 * switches a mutant on per test, so code run before the tests is never mutated).
 */
function sample(): void {
  if (made) return;
  tracks = measureTracks(simulateChamber(resolveScenario(scenario), 3).hits, { fieldT: 2 });
  byName = identifyTracks(tracks, { fieldT: 2, material: 'liquid-propane', volume, species: ['electron', 'mu-', 'pi+', 'K+', 'proton'] });
  byObject = identifyTracks(tracks, { fieldT: 2, material: material('liquid-propane'), volume });
  made = true;
}
beforeEach(sample, 120_000);

const same = (a: number, b: number) => (Number.isNaN(a) ? Number.isNaN(b) : a === b);

describe('identifyTracks: the table columns', () => {
  it('has one row per track, each column equal to its track identity', () => {
    const t = byObject;
    expect(tracks.count).toBeGreaterThan(30);
    expect(t.count).toBe(tracks.count);
    expect(t.pid).toHaveLength(tracks.count);
    expect(t.identities).toHaveLength(tracks.count);
    expect(t.species).toEqual(['electron', 'mu-', 'pi+', 'K+', 'proton']);
    let stopping = 0;
    for (let k = 0; k < t.count; k++) {
      const id = t.identities[k];
      expect(t.pid[k]).toBe(id.pid);
      expect(same(t.deltaM2lnL[k], id.deltaM2lnL)).toBe(true);
      expect(same(t.pGeV[k], id.pGeV)).toBe(true);
      expect(same(t.sigmaPGeV[k], id.sigmaPGeV)).toBe(true);
      expect(same(t.pMinGeV[k], id.pMinGeV)).toBe(true);
      expect(t.stops[k]).toBe(id.stop.stops ? 1 : 0);
      stopping += t.stops[k];
      t.species.forEach((s, i) => expect(same(t.m2lnL[s][k], id.hypotheses[i].m2lnL)).toBe(true));
    }
    expect(stopping).toBeGreaterThan(10);
  });

  it('takes a material and species by name as by object', () => {
    expect(byName.pid).toEqual(byObject.pid);
    for (let k = 0; k < tracks.count; k++) expect(same(byName.deltaM2lnL[k], byObject.deltaM2lnL[k])).toBe(true);
  });

  it("takes each fitted track's turning sense from its κ: flipping κ flips the charge", () => {
    const flipped = identifyTracks({ ...tracks, kappa: Float64Array.from(tracks.kappa, (v) => -v) }, { fieldT: 2, material: 'liquid-propane', volume });
    let checked = 0;
    for (let k = 0; k < tracks.count; k++) {
      const fitted = tracks.status[k] === 'ok' || tracks.status[k] === 'poor-fit';
      if (!fitted || !Number.isFinite(tracks.kappa[k]) || tracks.kappa[k] === 0) continue;
      // B along +z: counter-clockwise (κ > 0) is a negative particle.
      expect(byObject.identities[k].charge).toBe(tracks.kappa[k] > 0 ? -1 : 1);
      expect(flipped.identities[k].charge).toBe(-byObject.identities[k].charge);
      checked++;
    }
    expect(checked).toBeGreaterThan(30);
  });

  it('takes the turning sense from the hits where the circle fit gives none: not fitted, κ not finite, or κ = 0', () => {
    const opts = { fieldT: 2, material: 'liquid-propane', volume } as const;
    const unfitted = { ...tracks, status: tracks.status.map(() => 'degenerate' as const) };
    const fromHits = identifyTracks(unfitted, opts);
    // κ of an unfitted track is not looked at: flipping it changes nothing.
    const flippedUnfitted = identifyTracks({ ...unfitted, kappa: Float64Array.from(tracks.kappa, (v) => -v) }, opts);
    const notFinite = identifyTracks({ ...tracks, kappa: new Float64Array(tracks.count).fill(NaN) }, opts);
    const zero = identifyTracks({ ...tracks, kappa: new Float64Array(tracks.count) }, opts);
    expect(flippedUnfitted.pid).toEqual(fromHits.pid);
    expect(notFinite.pid).toEqual(fromHits.pid);
    expect(zero.pid).toEqual(fromHits.pid);
    // …and the hits do decide it: on this sample they agree with κ for most fitted tracks, not all.
    let agree = 0, fitted = 0;
    for (let k = 0; k < tracks.count; k++) {
      if (tracks.status[k] !== 'ok' && tracks.status[k] !== 'poor-fit') continue;
      fitted++;
      if (fromHits.identities[k].charge === byObject.identities[k].charge) agree++;
    }
    expect(fitted).toBeGreaterThan(30);
    expect(agree).toBeGreaterThan(0.8 * fitted);
  });
});
