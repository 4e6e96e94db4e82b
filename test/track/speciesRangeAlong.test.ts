import { describe, expect, it } from 'vitest';
import { cachedEnergyAt, cachedEnergyAtCell, cachedRange } from '../../lib/matter/rangeIntegral.js';
import { material } from '../../lib/matter/materials.js';
import { MUON_MINUS, PROTON } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';
import { speciesRange } from '../../lib/track/speciesRange.js';

describe('range look-ups searched from the previous cell (the per-hit path of identification)', () => {
  it('cachedEnergyAtCell gives cachedEnergyAt bit for bit: small steps down a track, jumps, the table ends and beyond', () => {
    const c = cachedRange(PROTON, material('liquid-propane'));
    const r = c.csdaRangeGcm2, cell = new Int32Array(1);
    const rng = seededRandom(11, 'cell');
    const ranges: number[] = [];
    for (let x = 40; x > 1e-4; x *= 0.97) ranges.push(x); // a stopping track, hit by hit
    for (let k = 0; k < 300; k++) ranges.push(r[r.length - 1] * rng.uniform() ** 6); // jumps anywhere
    ranges.push(0, -1, r[0], r[0] * 0.5, r[1], r[r.length - 1], r[r.length - 1] * 2, NaN);
    for (const x of ranges) expect(cachedEnergyAtCell(c, x, cell)).toBe(cachedEnergyAt(c, x));
    cell[0] = -5; // a bad hint is ignored
    expect(cachedEnergyAtCell(c, 3, cell)).toBe(cachedEnergyAt(c, 3));
    cell[0] = 1e6;
    expect(cachedEnergyAtCell(c, 3, cell)).toBe(cachedEnergyAt(c, 3));
  });
  it('momentaAlong gives momentumGeV at every hit, 0 past the end of the range', () => {
    const range = speciesRange(MUON_MINUS, material('liquid-hydrogen'));
    const path = Float64Array.from({ length: 60 }, (_, i) => 0.005 * i);
    const out = new Float64Array(60);
    for (const end of [0.1, 0.29, 0.3, 0.31, 2, 50]) {
      range.momentaAlong(end, path, out);
      for (let i = 0; i < 60; i++) expect(out[i]).toBe(range.momentumGeV(end - path[i]));
    }
    range.momentaAlong(0.1, path, out);
    expect(out[30]).toBe(0);
    expect(out[0]).toBeGreaterThan(out[10]);
  });
});
