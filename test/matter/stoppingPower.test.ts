import { describe, expect, it, beforeEach } from 'vitest';
import pstar from '../fixtures/pstar/water-protons.json' with { type: 'json' };
import estar from '../fixtures/estar/water-electrons.json' with { type: 'json' };
import pdgMin from '../fixtures/pdg-materials/min-ionization.json' with { type: 'json' };
import { AVOGADRO_PER_MOL, BETHE_K_MEV_CM2_PER_MOL, CLASSICAL_ELECTRON_RADIUS_CM, ELECTRON_MASS_MEV } from '../../lib/constants.js';
import { ALPHA, ELECTRON, KAON_SHORT, MUON_MINUS, POSITRON, PROTON } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { SagittaError } from '../../lib/errors.js';
import {
  betheStoppingPower, collisionStoppingPower, kineticFromBetaGamma, massStoppingPower, material,
  linearStoppingPower, maxEnergyTransferMeV,
} from '../../lib/matter/index.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
beforeEach(() => void consumeWarnings());

/** Minimum of S over βγ on a fine log grid (muons, as the PDG tables). */
function minimumIonisation(name: string): number {
  const m = material(name);
  let min = Infinity;
  for (let l = 0; l <= 1.5; l += 0.0005) min = Math.min(min, massStoppingPower(MUON_MINUS, m, kineticFromBetaGamma(MUON_MINUS, 10 ** l)));
  return min;
}

describe('Bethe coefficient K', () => {
  it('4π N_A r_e² m_e c² from CODATA 2018 reproduces PDG K = 0.307075 MeV mol⁻¹ cm² to 1e-5', () => {
    // PDG RPP, Table "Summary of variables used in this section": K = 0.307075 MeV mol⁻¹ cm².
    const k = 4 * Math.PI * AVOGADRO_PER_MOL * CLASSICAL_ELECTRON_RADIUS_CM ** 2 * ELECTRON_MASS_MEV;
    expect(k).toBe(BETHE_K_MEV_CM2_PER_MOL);
    expect(rel(k, 0.307075)).toBeLessThan(1e-5);
  });
});

describe('massStoppingPower for heavy particles (Bethe)', () => {
  it('matches NIST PSTAR protons in water from 10 to 200 MeV at each row’s documented deviation (±0.05 points), all within 0.2 %', () => {
    // Source: NIST PSTAR / ICRU 49, test/fixtures/pstar/water-protons.json (read from the database output).
    // Measured deviations [%] (issue 15): the shell-corrected Bethe approaches PSTAR from below.
    const documented: Record<number, number> = { 10: -0.173, 20: -0.077, 50: -0.010, 100: 0.014, 150: 0.011, 200: 0.018 };
    let checked = 0;
    for (const row of pstar.rows.filter((r) => r.kineticEnergyMeV >= 10)) {
      const d = 100 * (massStoppingPower(PROTON, material('water'), row.kineticEnergyMeV) / row.stoppingPower - 1);
      expect(Math.abs(d - documented[row.kineticEnergyMeV]), `T = ${row.kineticEnergyMeV} MeV`).toBeLessThan(0.05);
      expect(Math.abs(d)).toBeLessThan(0.2);
      checked++;
    }
    expect(checked).toBe(6);
  });
  it('is within 1 % of PSTAR at 1 MeV (+0.59 %, the fit–Bethe join; test/matter/lowEnergy.test.ts has every row)', () => {
    // Source: NIST PSTAR 1 MeV water total, 260.8 MeV cm²/g (test/fixtures/pstar/water.txt).
    const d = massStoppingPower(PROTON, material('water'), 1) / 260.8 - 1;
    expect(Math.abs(d - 0.0059)).toBeLessThan(1.5e-3);
  });
  it('reproduces the PDG minimum-ionisation dE/dx within 0.1 % per material (emulsion: its documented +0.43 %)', () => {
    // Source: PDG RPP "Atomic and Nuclear Properties", test/fixtures/pdg-materials/min-ionization.json
    // (rows marked (memory) there were recalled). Measured (issue 15): −0.08 … −0.01 % for every material
    // but emulsion, which sits +0.43 % high (unverified recalled value), asserted ±0.05. The printed
    // four digits round to ±0.03 %.
    let checked = 0;
    for (const row of pdgMin.rows) {
      const d = minimumIonisation(row.material) / row.minDedx - 1;
      if (row.material === 'nuclear-emulsion') expect(Math.abs(d - 0.0043), row.material).toBeLessThan(5e-4);
      else expect(Math.abs(d), row.material).toBeLessThan(1e-3);
      checked++;
    }
    expect(checked).toBe(pdgMin.rows.length);
  });
  it('scales with z²: an alpha at the same βγ loses 4× a proton’s', () => {
    // Common practice: Bethe ∝ z² at fixed β (T_max differs slightly through M; checked at βγ = 1).
    const w = material('water');
    const sa = betheStoppingPower(ALPHA, w, kineticFromBetaGamma(ALPHA, 1));
    const sp = betheStoppingPower(PROTON, w, kineticFromBetaGamma(PROTON, 1));
    expect(rel(sa / sp, 4)).toBeLessThan(2e-3);
  });
  it('maxEnergyTransferMeV → 2 m_e c² β²γ² for a heavy slow particle and → the full energy for e-like mass', () => {
    // PDG RPP exact T_max formula, limits (common practice).
    expect(rel(maxEnergyTransferMeV(PROTON.massMeV, 0.1), 2 * ELECTRON_MASS_MEV * 0.01)).toBeLessThan(2e-3);
  });
  it('linearStoppingPower = mass stopping power × density (PSTAR water 100 MeV: 7.289 MeV/cm at ρ = 1)', () => {
    expect(rel(linearStoppingPower(PROTON, material('water'), 100), 7.289)).toBeLessThan(0.01);
    const si = material('silicon');
    expect(linearStoppingPower(PROTON, si, 100)).toBeCloseTo(massStoppingPower(PROTON, si, 100) * 2.329, 12);
  });
  it('returns NaN with an OUTSIDE_VALIDITY warning at T ≤ 0 and above βγ = 1000, never a number', () => {
    expect(massStoppingPower(PROTON, material('water'), 0)).toBeNaN();
    expect(massStoppingPower(MUON_MINUS, material('water'), 2e6)).toBeNaN();
    expect(massStoppingPower(PROTON, material('water'), -1)).toBeNaN();
    const w = consumeWarnings();
    expect(w.map((x) => x.code)).toEqual(['OUTSIDE_VALIDITY', 'OUTSIDE_VALIDITY', 'OUTSIDE_VALIDITY']);
    expect(w[0].message).toMatch(/proton at T = 0 MeV/);
  });
  it('refuses a neutral particle as a bad call, word for word', () => {
    expect(() => massStoppingPower(KAON_SHORT, material('water'), 100)).toThrow(SagittaError);
    expect(() => collisionStoppingPower(KAON_SHORT, material('water'), 100))
      .toThrow('particle = "K0S" is not valid: expected a charged particle (neutral particles do not lose energy by ionisation)');
  });
  it('ends at βγ = 1000 (proton T = M(√(1 + 10⁶) − 1) = 937 335 MeV): finite below, NaN with the warning text above', () => {
    // The top of validity is a kinematic identity (common practice); the warning rounds it to 3 digits.
    expect(Number.isFinite(massStoppingPower(PROTON, material('water'), 937_300))).toBe(true);
    expect(Number.isFinite(collisionStoppingPower(PROTON, material('water'), 937_300))).toBe(true);
    expect(consumeWarnings()).toEqual([]);
    expect(massStoppingPower(PROTON, material('water'), 937_400)).toBeNaN();
    expect(collisionStoppingPower(PROTON, material('water'), 937_400)).toBeNaN();
    expect(consumeWarnings().map((w) => [w.code, w.source, w.message])).toEqual([
      ['OUTSIDE_VALIDITY', 'massStoppingPower', 'massStoppingPower: proton at T = 937400 MeV is outside the validity range 0–937000 MeV; result is NaN'],
      ['OUTSIDE_VALIDITY', 'collisionStoppingPower', 'collisionStoppingPower: proton at T = 937400 MeV is outside the validity range 0–937000 MeV; result is NaN'],
    ]);
  });
  it('warns, naming the function, where a material has no ICRU 49 low-energy fit (liquid propane at 0.5 MeV)', () => {
    const prop = material('liquid-propane');
    expect(collisionStoppingPower(PROTON, prop, 0.5)).toBeGreaterThan(400);
    expect(massStoppingPower(PROTON, prop, 0.5)).toBeGreaterThan(collisionStoppingPower(PROTON, prop, 0.5));
    const tail = 'has no ICRU 49 low-energy fit at this energy (below the proton-equivalent 2 MeV, or 100 MeV for I > 400 eV); the value there is good to ~5–20 % only (lib/matter/README.md)';
    expect(consumeWarnings().map((w) => [w.code, w.source, w.message])).toEqual([
      ['APPROXIMATION', 'collisionStoppingPower', `collisionStoppingPower: proton in liquid-propane at T = 0.5 MeV ${tail}`],
      ['APPROXIMATION', 'massStoppingPower', `massStoppingPower: proton in liquid-propane at T = 0.5 MeV ${tail}`],
    ]);
    // Water has the fit: no warning at the same energy.
    massStoppingPower(PROTON, material('water'), 0.5);
    expect(consumeWarnings()).toEqual([]);
  });
});

describe('electron and positron stopping (ICRU 37 collision + screened Bethe–Heitler radiative)', () => {
  it('collision stopping power of 1 MeV electrons in water is at its documented −0.50 % from ESTAR 1.849', () => {
    // Source: NIST ESTAR / ICRU 37, liquid water, 1 MeV (test/fixtures/estar).
    const d = collisionStoppingPower(ELECTRON, material('water'), 1) / estar.rows[0].collision - 1;
    expect(Math.abs(d + 0.005)).toBeLessThan(1.5e-3);
  });
  it('the ESTAR collision values at 10 and 100 MeV (water) at their documented +0.37 % and +0.04 % (±0.1 points)', () => {
    // Source: NIST ESTAR / ICRU 37, test/fixtures/estar/water-electrons.json (read from the database output).
    const documented: Record<number, number> = { 10: 0.37, 100: 0.04 };
    let checked = 0;
    for (const r of estar.rows.slice(1)) {
      const d = 100 * (collisionStoppingPower(ELECTRON, material('water'), r.kineticEnergyMeV) / r.collision - 1);
      expect(Math.abs(d - documented[r.kineticEnergyMeV]), `${r.kineticEnergyMeV} MeV`).toBeLessThan(0.1);
      checked++;
    }
    expect(checked).toBe(2);
  });
  it('positrons (Bhabha) lose slightly less than electrons (Møller) at 1 MeV in water (ICRU 37: ≈ 1.80 vs 1.85)', () => {
    // ICRU 37 tables give e⁺ collision stopping a few per cent below e⁻ at 1 MeV in light media (memory).
    const ep = collisionStoppingPower(POSITRON, material('water'), 1);
    const em = collisionStoppingPower(ELECTRON, material('water'), 1);
    expect(ep).toBeLessThan(em);
    expect(em / ep - 1).toBeLessThan(0.05);
  });
  it('is NaN + warning below 10 keV', () => {
    expect(massStoppingPower(ELECTRON, material('water'), 0.005)).toBeNaN();
    expect(consumeWarnings().length).toBeGreaterThan(0);
  });
});
