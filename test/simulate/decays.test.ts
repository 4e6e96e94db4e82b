import { describe, expect, it } from 'vitest';
import { KAON_SHORT, LAMBDA, MUON_PLUS, PION_MINUS, PION_PLUS, PROTON } from '../../lib/particles.js';
import { chamber, michelMaxEnergyMeV, sampleMichelFraction, seededRandom, simulateChamber, twoBodyDecay, type SimulationConfig } from '../../lib/simulate/index.js';
import { invariantMassMeV, twoBodyMomentumMeV } from '../../lib/vertex/index.js';
import { chamberMedium, VACUUM } from '../../lib/matter/index.js';

// Reference values: PDG RPP 2022 listings, see test/fixtures/pdg-decays/README.md.
const PDG_P_KS_PIPI = 206;
const PDG_P_LAMBDA_PPI = 101;
const PDG_P_PI_MUNU = 30;

describe('two-body decays reproduce the PDG kinematics', () => {
  it('twoBodyMomentumMeV: K⁰_S → π⁺π⁻ 206 MeV/c, Λ → pπ⁻ 101 MeV/c, π⁺ → μ⁺ν 30 MeV/c (PDG listings, ±0.5)', () => {
    expect(Math.abs(twoBodyMomentumMeV(KAON_SHORT.massMeV, PION_PLUS.massMeV, PION_MINUS.massMeV) - PDG_P_KS_PIPI)).toBeLessThan(0.5);
    expect(Math.abs(twoBodyMomentumMeV(LAMBDA.massMeV, PROTON.massMeV, PION_MINUS.massMeV) - PDG_P_LAMBDA_PPI)).toBeLessThan(0.5);
    expect(Math.abs(twoBodyMomentumMeV(PION_PLUS.massMeV, MUON_PLUS.massMeV, 0) - PDG_P_PI_MUNU)).toBeLessThan(0.5);
    expect(twoBodyMomentumMeV(100, 60, 60)).toBeNaN();
  });

  it('twoBodyDecay of moving Λ: daughters rebuild the parent mass (1e-9 relative) and momentum; cos θ* is uniform', () => {
    const rng = seededRandom(21);
    let sumCos = 0, sumCos2 = 0;
    const n = 4000;
    for (let i = 0; i < n; i++) {
      const p = [300 * (rng.uniform() - 0.5), 2000 * rng.uniform(), 500 * rng.gaussian()];
      const d = twoBodyDecay(LAMBDA.massMeV, p[0], p[1], p[2], PROTON.massMeV, PION_MINUS.massMeV, rng);
      expect(Math.abs(invariantMassMeV(d.first, d.second) / LAMBDA.massMeV - 1)).toBeLessThan(1e-9);
      for (let k = 1; k < 4; k++) expect(d.first[k] + d.second[k]).toBeCloseTo(p[k - 1], 7);
      expect(d.first[0] ** 2 - d.first[1] ** 2 - d.first[2] ** 2 - d.first[3] ** 2).toBeCloseTo(PROTON.massMeV ** 2, 3);
      sumCos += d.cosThetaStar;
      sumCos2 += d.cosThetaStar ** 2;
    }
    // Uniform on [−1, 1]: mean 0 (σ_mean = 0.009), mean square 1/3.
    expect(Math.abs(sumCos / n)).toBeLessThan(0.04);
    expect(Math.abs(sumCos2 / n - 1 / 3)).toBeLessThan(0.02);
  });

  it('simulateChamber with a K⁰_S beam: each decay pair has invariant mass 497.611 MeV and p* = 206 MeV/c; mean flight = βγcτ', () => {
    const config: SimulationConfig = {
      name: 'ks-check',
      chamber: chamber({ sizeM: [40, 40, 40], medium: VACUUM, fieldT: [0, 0, 1] }),
      transport: { energyLoss: 'off', scattering: false, maxStepM: 0.05, maxPathM: 0.1, deltaRayMinMeV: 0 },
      measurement: { sampling: { kind: 'spacing', spacingM: 0.05 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0 },
      sources: [{ kind: 'beam', events: 3000, species: [{ particle: KAON_SHORT, weight: 1 }], momentumGeV: 1, momentumSpread: 0, originM: [-19, 0, 0], direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0 }],
    };
    const r = simulateChamber(config, 8);
    const t = r.truth;
    let flights = 0, decays = 0;
    for (let i = 0; i < t.length; i++) {
      if (t.species[i] !== 'K0S') continue;
      expect(t.end[i]).toBe('decayed');
      flights += t.pathM[i];
      decays++;
      const kids = [];
      for (let j = 0; j < t.length; j++) if (t.event[j] === t.event[i] && t.parent[j] === t.track[i]) kids.push(j);
      expect(kids.map((j) => t.species[j]).sort()).toEqual(['pi+', 'pi-']);
      const four = kids.map((j) => {
        const p = [t.px[j], t.py[j], t.pz[j]].map((v) => v * 1e3);
        return [Math.hypot(Math.hypot(p[0], p[1], p[2]), PION_PLUS.massMeV), p[0], p[1], p[2]];
      });
      const m = invariantMassMeV(four[0], four[1]);
      expect(Math.abs(m - KAON_SHORT.massMeV)).toBeLessThan(1e-6);
      expect(Math.abs(Math.sqrt(m * m / 4 - PION_PLUS.massMeV ** 2) - PDG_P_KS_PIPI)).toBeLessThan(0.5);
    }
    expect(decays).toBe(3000);
    const betaGammaCtau = (1000 / KAON_SHORT.massMeV) * KAON_SHORT.ctauM;
    // Exponential: σ_mean = mean/√N ≈ 1.8 %.
    expect(Math.abs(flights / decays / betaGammaCtau - 1)).toBeLessThan(0.06);
  });
});

describe('decay at rest of a stopping muon', () => {
  it('Michel spectrum x²(3 − 2x): mean x = 0.7, end point W = 52.83 MeV (PDG muon decay parameters, (memory))', () => {
    expect(michelMaxEnergyMeV(MUON_PLUS.massMeV)).toBeCloseTo(52.83, 2);
    const rng = seededRandom(4);
    const n = 40000;
    let s = 0, above = 0;
    for (let i = 0; i < n; i++) {
      const x = sampleMichelFraction(rng);
      s += x;
      if (x > 0.5) above++;
    }
    // Mean 0.7 (σ_mean = 0.2/√N ≈ 0.001); P(x > 1/2) = 1 − 2∫₀^½ x²(3−2x) dx = 13/16.
    expect(Math.abs(s / n - 0.7)).toBeLessThan(0.004);
    expect(Math.abs(above / n - 13 / 16)).toBeLessThan(0.01);
  });

  it('a stopping μ⁺ in liquid hydrogen is followed by one e⁺ from its end point with E ≤ 52.83 MeV', () => {
    const config: SimulationConfig = {
      name: 'michel-check',
      chamber: chamber({ sizeM: [2, 2, 2], medium: chamberMedium('liquid hydrogen'), fieldT: [0, 0, 1.5] }),
      transport: { energyLoss: 'mean', scattering: true, maxStepM: 0.01, maxPathM: 10, deltaRayMinMeV: 0 },
      measurement: { sampling: { kind: 'spacing', spacingM: 0.01 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0 },
      sources: [{ kind: 'stopping', events: 50, species: MUON_PLUS, minDepthM: 0.2, maxDepthM: 0.4, originM: [-0.9, 0, 0], direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0 }],
    };
    const t = simulateChamber(config, 9).truth;
    let muons = 0;
    for (let i = 0; i < t.length; i++) {
      if (t.species[i] !== 'mu+') continue;
      muons++;
      expect(t.end[i]).toBe('stopped');
      expect(t.pathM[i]).toBeGreaterThan(0.2 - 1e-6);
      expect(t.pathM[i]).toBeLessThan(0.4 + 1e-6);
      const j = i + 1;
      expect(t.species[j]).toBe('positron');
      expect(t.parent[j]).toBe(t.track[i]);
      expect([t.vx[j], t.vy[j], t.vz[j]]).toEqual([t.ex[i], t.ey[i], t.ez[i]]);
      const e = Math.hypot(Math.hypot(t.px[j], t.py[j], t.pz[j]) * 1e3, 0.51099895);
      expect(e).toBeLessThanOrEqual(52.83);
    }
    // The loop above asserts per muon: it must have run once per event (50 stopping μ⁺).
    expect(muons).toBe(50);
  });
});

describe('decay in flight of charged pions', () => {
  it('π⁻ of 0.3 GeV/c: the fraction decaying within 2 m is 1 − exp(−L/βγcτ) (cτ = 7.8045 m, PDG); the μ⁻ and the unseen ν are a massless pair', () => {
    const n = 4000;
    const config: SimulationConfig = {
      name: 'pi-decay',
      chamber: chamber({ sizeM: [40, 40, 40], medium: VACUUM, fieldT: [0, 0, 1] }),
      transport: { energyLoss: 'off', scattering: false, maxStepM: 0.05, maxPathM: 2, deltaRayMinMeV: 0 },
      measurement: { sampling: { kind: 'spacing', spacingM: 0.5 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0 },
      sources: [{ kind: 'beam', events: n, species: [{ particle: PION_MINUS, weight: 1 }], momentumGeV: 0.3, momentumSpread: 0, originM: [0, 0, 0], direction: [1, 0, 0], spotSigmaM: 0, divergenceRad: 0 }],
    };
    const t = simulateChamber(config, 13).truth;
    let decayed = 0;
    for (let i = 0; i < t.length; i++) {
      if (t.species[i] !== 'pi-' || t.end[i] !== 'decayed') continue;
      decayed++;
      expect(t.pathM[i]).toBeLessThanOrEqual(2);
      const j = i + 1;
      expect(t.species[j]).toBe('mu-');
      expect([t.vx[j], t.vy[j], t.vz[j]]).toEqual([t.ex[i], t.ey[i], t.ez[i]]);
      // The pion keeps |p| (no loss); at the end point its direction has turned in the field, so
      // use the four-momentum difference: (p_π − p_μ)² = m_ν² = 0.
      const pmu = [t.px[j], t.py[j], t.pz[j]].map((v) => v * 1e3);
      const emu = Math.hypot(Math.hypot(pmu[0], pmu[1], pmu[2]), MUON_PLUS.massMeV);
      const epi = Math.hypot(300, PION_MINUS.massMeV);
      const pnuMag = epi - emu;
      // |p_ν| = E_ν for a massless ν, and the pion rest-frame momentum fixes E_ν range: check the
      // muon energy lies in the kinematic band of a 300 MeV/c pion decaying to μν.
      const g = epi / PION_MINUS.massMeV, bg = 300 / PION_MINUS.massMeV;
      const eStar = Math.hypot(PDG_P_PI_MUNU_EXACT, MUON_PLUS.massMeV);
      expect(emu).toBeGreaterThanOrEqual(g * eStar - bg * PDG_P_PI_MUNU_EXACT - 1e-6);
      expect(emu).toBeLessThanOrEqual(g * eStar + bg * PDG_P_PI_MUNU_EXACT + 1e-6);
      expect(pnuMag).toBeGreaterThan(0);
    }
    const expected = n * (1 - Math.exp(-2 / ((300 / PION_MINUS.massMeV) * PION_MINUS.ctauM)));
    expect(Math.abs(decayed - expected)).toBeLessThan(4 * Math.sqrt(expected));
  });
});

const PDG_P_PI_MUNU_EXACT = twoBodyMomentumMeV(PION_PLUS.massMeV, MUON_PLUS.massMeV, 0);
