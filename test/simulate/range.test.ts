import { describe, expect, it } from 'vitest';
import { csdaRange, material } from '../../lib/matter/index.js';
import { MUON_PLUS, PROTON, type Particle } from '../../lib/particles.js';
import { chamber, seededRandom, transportTrack, TRANSPORT_DEFAULTS, type EnergyLossMode } from '../../lib/simulate/index.js';
import { chamberMedium } from '../../lib/matter/index.js';

/**
 * Stopping tracks: the path length the simulator travels before the particle stops must equal the
 * CSDA range of the matter module (R = ∫dT/S; ICRU 49 definition) — the check that the stepping,
 * the range-table interpolation and the stop condition lose nothing. With Bohr straggling on, the
 * mean path still equals the CSDA range (straggling is symmetric at first order) within 1 %.
 */
const lh2 = material('liquid hydrogen');
const medium = chamberMedium(lh2);
const box = chamber({ sizeM: [20, 20, 20], medium, fieldT: [0, 0, 1.5] });

function stop(species: Particle, kineticMeV: number, mode: EnergyLossMode, scattering: boolean, seed: number) {
  const p = Math.sqrt(kineticMeV * (kineticMeV + 2 * species.massMeV)) / 1000;
  return transportTrack({ species, xM: 0, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: p }, box,
    { ...TRANSPORT_DEFAULTS, energyLoss: mode, scattering }, seededRandom(seed), () => {});
}

describe('simulated range of stopping particles equals the CSDA range of lib/matter', () => {
  const cases: [Particle, number][] = [[PROTON, 30], [PROTON, 100], [PROTON, 250], [MUON_PLUS, 10], [MUON_PLUS, 60]];
  for (const [sp, t] of cases) {
    it(`${sp.name} ${t} MeV in liquid hydrogen: path = CSDA range within 1e-6 (mean loss, with scattering)`, () => {
      const r = stop(sp, t, 'mean', true, 5);
      const csdaM = csdaRange(sp, lh2, t) / lh2.densityGcm3 / 100;
      expect(r.reason).toBe('stopped');
      expect(Math.abs(r.pathM / csdaM - 1)).toBeLessThan(1e-6);
    });
  }

  it('protons of 100 MeV with straggling: mean path within 1 % of CSDA, spread a few per cent', () => {
    const n = 400;
    const paths = Array.from({ length: n }, (_, i) => stop(PROTON, 100, 'straggling', false, 100 + i).pathM);
    const mean = paths.reduce((a, b) => a + b, 0) / n;
    const sd = Math.sqrt(paths.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
    const csdaM = csdaRange(PROTON, lh2, 100) / lh2.densityGcm3 / 100;
    expect(Math.abs(mean / csdaM - 1)).toBeLessThan(0.01);
    // Range straggling of protons is ~1 % of the range (common practice; ≈1.2 % in water at 100 MeV).
    expect(sd / csdaM).toBeGreaterThan(0.003);
    expect(sd / csdaM).toBeLessThan(0.03);
  });

  it('a stopping track spirals inwards: the radius of curvature shrinks along the track', () => {
    const hits: number[][] = [];
    const p = Math.sqrt(60 * (60 + 2 * MUON_PLUS.massMeV)) / 1000;
    transportTrack({ species: MUON_PLUS, xM: 0, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: p }, box,
      { ...TRANSPORT_DEFAULTS, energyLoss: 'mean', scattering: false }, seededRandom(1), (x, y, _z, pp) => hits.push([x, y, pp]));
    const mom = hits.map((h) => h[2]);
    for (let i = 1; i < mom.length; i++) expect(mom[i]).toBeLessThan(mom[i - 1]);
    expect(mom[mom.length - 1]).toBeLessThan(0.3 * p);
  });

  it('the medium range table and its inverse agree (kineticFromRangeM ∘ rangeM = identity within 1e-7; two separate cubic Hermite interpolants)', () => {
    const loss = medium.forSpecies(PROTON);
    for (const t of [0.2, 1, 5, 50, 500, 5000]) expect(Math.abs(loss.kineticFromRangeM(loss.rangeM(t)) / t - 1)).toBeLessThan(1e-7);
  });
});
