import { describe, expect, it } from 'vitest';
import { csdaRange, massStoppingPower, material } from '../../lib/matter/index.js';
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

  it('protons of 100 MeV with straggling: mean path within 0.2 % of CSDA; spread equal to the Bohr range straggling within 12 %', () => {
    const n = 400;
    const paths = Array.from({ length: n }, (_, i) => stop(PROTON, 100, 'straggling', false, 100 + i).pathM);
    const mean = paths.reduce((a, b) => a + b, 0) / n;
    const sd = Math.sqrt(paths.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
    const csdaM = csdaRange(PROTON, lh2, 100) / lh2.densityGcm3 / 100;
    // Mean: statistical error sd/√400 ≈ 0.05 % (seed 100…499: −0.05 %).
    expect(Math.abs(mean / csdaM - 1)).toBeLessThan(0.002);
    // Expected spread, independently of the simulator: σ_R² = ∫ (dσ²/dx) / S(E)³ dE with Bohr’s
    // dσ²/dx = K m_e c² (Z/A) (N. Bohr, Phil. Mag. 30 (1915) 581; K and m_e c² as literals, PDG /
    // CODATA 2018) and S from lib/matter, midpoint rule from 1 keV. That gives 1.00 % of the range
    // (protons range-straggle by about 1 % of their range: common practice). The sample sd has a
    // statistical error of 1/√(2·399) = 3.5 %; seed 100…499 gives +1.6 %.
    const kBohr = 0.307075 * 0.51099895 * lh2.zOverA;
    let variance = 0;
    const steps = 4000, lo = 0.001, hi = 100;
    for (let i = 0; i < steps; i++) variance += (kBohr / massStoppingPower(PROTON, lh2, lo + ((hi - lo) * (i + 0.5)) / steps) ** 3) * ((hi - lo) / steps);
    const sigmaRangeM = Math.sqrt(variance) / lh2.densityGcm3 / 100;
    expect(Math.abs(sd / sigmaRangeM - 1)).toBeLessThan(0.12);
    expect(sigmaRangeM / csdaM).toBeGreaterThan(0.009);
    expect(sigmaRangeM / csdaM).toBeLessThan(0.011);
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
