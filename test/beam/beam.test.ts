import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  ATOMIC_MASS_CONSTANT_KG, chargeToMassFromOrbit, completeEllipticIntegrals, cyclotronFrequencyHz, ELECTRON_MASS_U, fitChargeToMass,
  helmholtzCentreFieldT, helmholtzField, identifyIsotope, isotope, ISOTOPES, magneticRigidityTm, massToChargeFromSector, massToChargeInU,
  orbitFieldUniformity, plateDeflection, rigidityFromKineticTm, sectorRadiusM, selectedSpeedMPerS, type ChargeToMassPoint,
} from '../../lib/beam/index.js';
import { ATOMIC_MASS_UNIT_MEV, ELECTRON_CHARGE_TO_MASS_C_KG, ELECTRON_MASS_KG, ELEMENTARY_CHARGE_C } from '../../lib/constants.js';
import { PROTON } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';

// CODATA 2018 (test/fixtures/codata2018/README.md).
const CODATA_E_OVER_ME = 1.75882001076e11;
const CODATA_MU_KG = 1.6605390666e-27;
const CODATA_MU_MEV = 931.49410242;
const CODATA_ME_U = 5.48579909065e-4;
const CODATA_MP_U = 1.007276466621;

describe('constants against CODATA 2018', () => {
  it('e/m_e, m_u (kg and MeV) and m_e in u are the CODATA 2018 values; e/m_e = e/m_e from e and m_e (1e-10)', () => {
    expect(ELECTRON_CHARGE_TO_MASS_C_KG).toBe(CODATA_E_OVER_ME);
    expect(ATOMIC_MASS_CONSTANT_KG).toBe(CODATA_MU_KG);
    expect(ATOMIC_MASS_UNIT_MEV).toBe(CODATA_MU_MEV);
    expect(ELECTRON_MASS_U).toBe(CODATA_ME_U);
    expect(Math.abs(ELEMENTARY_CHARGE_C / ELECTRON_MASS_KG / CODATA_E_OVER_ME - 1)).toBeLessThan(1e-10);
  });
});

describe('e/m from a beam tube', () => {
  it('chargeToMassFromOrbit: a point made with CODATA e/m gives it back (1e-12); errors add as (σV/V)² + (2σB/B)² + (2σr/r)²', () => {
    const b = 1.2e-3, r = 0.045;
    const v = (CODATA_E_OVER_ME * b * b * r * r) / 2;
    const res = chargeToMassFromOrbit({ voltageV: v, fieldT: b, radiusM: r, sigmaVoltageV: 0.01 * v, sigmaFieldT: 0.01 * b, sigmaRadiusM: 0.02 * r });
    expect(Math.abs(res.valueCPerKg / CODATA_E_OVER_ME - 1)).toBeLessThan(1e-12);
    expect(res.sigmaCPerKg / res.valueCPerKg).toBeCloseTo(Math.sqrt(1e-4 + 4e-4 + 16e-4), 12);
  });

  it('fitChargeToMass: over 200 invented series of 8 points, the pulls (fit − CODATA)/σ_stat have mean 0 ± 0.2 and rms 1 ± 0.15, through the origin and with an offset', () => {
    const rng = seededRandom(42);
    const k = helmholtzCentreFieldT({ turns: 130, radiusM: 0.15, currentA: 1 });
    for (const throughOrigin of [true, false]) {
      const pulls: number[] = [];
      for (let s = 0; s < 200; s++) {
        const points: ChargeToMassPoint[] = [];
        for (let i = 0; i < 8; i++) {
          const v = 150 + 20 * i, current = 1.2 + 0.1 * (i % 4);
          const r = Math.sqrt((2 * v) / CODATA_E_OVER_ME) / (k * current) + (throughOrigin ? 0 : 0);
          points.push({
            voltageV: v + 1.0 * rng.gaussian(), sigmaVoltageV: 1.0,
            currentA: current + 0.01 * rng.gaussian(), sigmaCurrentA: 0.01,
            radiusM: r + 0.0008 * rng.gaussian(), sigmaRadiusM: 0.0008,
          });
        }
        const fit = fitChargeToMass(points, { teslaPerAmpere: k, throughOrigin });
        pulls.push((fit.valueCPerKg - CODATA_E_OVER_ME) / fit.sigmaStatCPerKg);
      }
      const mean = pulls.reduce((a, b) => a + b, 0) / pulls.length;
      const rms = Math.sqrt(pulls.reduce((a, b) => a + (b - mean) ** 2, 0) / pulls.length);
      expect(pulls.length).toBe(200);
      expect(Math.abs(mean)).toBeLessThan(0.2);
      expect(Math.abs(rms - 1)).toBeLessThan(0.15);
    }
  });

  it('fitChargeToMass: systematic error 2·√(δ_B² + δ_r²) of the value; p-value in (0, 1]', () => {
    const points: ChargeToMassPoint[] = [200, 250, 300].map((v, i) => ({ voltageV: v, sigmaVoltageV: 1, fieldT: 1e-3, sigmaFieldT: 1e-6, radiusM: Math.sqrt((2 * v) / CODATA_E_OVER_ME) / 1e-3 * (1 + 1e-3 * (i - 1)), sigmaRadiusM: 2e-4 }));
    const fit = fitChargeToMass(points, { fieldScaleRelative: 0.004, radiusScaleRelative: 0.003 });
    expect(fit.sigmaSystCPerKg / fit.valueCPerKg).toBeCloseTo(2 * Math.hypot(0.004, 0.003), 12);
    expect(fit.pValue).toBeGreaterThan(0);
    expect(fit.pValue).toBeLessThanOrEqual(1);
  });
});

describe('Helmholtz pair', () => {
  const coils = { turns: 130, radiusM: 0.15, currentA: 1.5 };
  it('centre field (4/5)^{3/2} μ₀NI/R equals the elliptic-integral field at the centre (1e-12)', () => {
    expect(Math.abs(helmholtzField(coils, 0, 0).bzT / helmholtzCentreFieldT(coils) - 1)).toBeLessThan(1e-12);
  });
  it('near the axis the elliptic form matches the on-axis Biot–Savart sum μ₀NIR²/2 Σ (R² + ζ²)^{-3/2} (1e-9)', () => {
    for (const z of [0.02, 0.06, 0.12]) {
      const onAxis = (1.25663706212e-6 * 130 * 1.5 * 0.15 ** 2) / 2 * ((0.15 ** 2 + (z - 0.075) ** 2) ** -1.5 + (0.15 ** 2 + (z + 0.075) ** 2) ** -1.5);
      expect(Math.abs(helmholtzField(coils, 1e-6, z).bzT / onAxis - 1)).toBeLessThan(1e-9);
    }
  });
  it('off the axis in the midplane: B_z/B₀ − 1 = −(54/125)(ρ/R)⁴ to leading order (the axial z⁴ term of a Helmholtz pair carried off axis by Laplace\'s equation); within 15 % of the deviation at ρ = 0.1 R', () => {
    const dev = helmholtzField(coils, 0.015, 0).bzT / helmholtzCentreFieldT(coils) - 1;
    const series = -(54 / 125) * 0.1 ** 4;
    expect(Math.abs(dev / series - 1)).toBeLessThan(0.15);
  });
  it('orbitFieldUniformity: an orbit of 5 cm about the axis sees a mean field below the centre one and no spread; 4 cm off axis its weakest field is the field 9 cm out (1e-12)', () => {
    const u = orbitFieldUniformity(coils, 0.05, 0);
    expect(u.relativeOffset).toBeLessThan(0);
    expect(u.relativeSpread).toBeLessThan(1e-6 + Math.abs(u.relativeOffset) * 0.01);
    const off = orbitFieldUniformity(coils, 0.05, 0.04);
    expect(off.relativeSpread).toBeGreaterThan(u.relativeSpread);
    expect(Math.abs(off.minT / helmholtzField(coils, 0.09, 0).bzT - 1)).toBeLessThan(1e-12);
  });
  it('completeEllipticIntegrals against Simpson quadrature of ∫₀^{π/2} (1 − m sin²θ)^{∓½} dθ (1e-11)', () => {
    let runs = 0;
    for (const m of [0, 0.1, 0.5, 0.9, 0.99]) {
      const n = 20000;
      let k = 0, e = 0;
      for (let i = 0; i <= n; i++) {
        const t = (Math.PI / 2) * (i / n);
        const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
        const q = 1 - m * Math.sin(t) ** 2;
        k += w / Math.sqrt(q); e += w * Math.sqrt(q);
      }
      const h = Math.PI / 2 / n / 3;
      const r = completeEllipticIntegrals(m);
      expect(Math.abs(r.k - k * h)).toBeLessThan(1e-11);
      expect(Math.abs(r.e - e * h)).toBeLessThan(1e-11);
      runs++;
    }
    expect(runs).toBe(5);
  });
});

describe('mass spectrometer and isotopes (AME 2020)', () => {
  it('lib/beam/isotopes.ts carries the AME 2020 masses of test/fixtures/ame2020 digit for digit', () => {
    const fixture = JSON.parse(readFileSync(new URL('../fixtures/ame2020/atomic-masses.json', import.meta.url), 'utf8')) as { isotopes: [string, number, number, number, number][] };
    expect(ISOTOPES.length).toBe(fixture.isotopes.length);
    fixture.isotopes.forEach(([el, z, a, mu, s], i) => {
      expect([ISOTOPES[i].element, ISOTOPES[i].z, ISOTOPES[i].a]).toEqual([el, z, a]);
      expect(ISOTOPES[i].massU).toBe(mu * 1e-6);
      expect(ISOTOPES[i].sigmaMassU).toBe(s * 1e-6);
    });
    expect(isotope('12C').massU).toBe(12);
  });
  it('¹H atomic mass (AME 2020) = m_p + m_e − 13.6 eV (CODATA 2018; binding 1.46e-8 u) within 1e-10 u', () => {
    const binding = 13.598e-6 / CODATA_MU_MEV;
    expect(Math.abs(isotope('1H').massU - (CODATA_MP_U + CODATA_ME_U - binding))).toBeLessThan(1e-10);
  });
  it('massToChargeFromSector inverts sectorRadiusM (1e-10: CODATA m_u in kg and in MeV agree to that rounding) and identifies ²⁰Ne⁺, ²²Ne⁺, ⁴⁰Ar²⁺ and ³⁵Cl⁺ from their radii', () => {
    let runs = 0;
    for (const [name, q] of [['20Ne', 1], ['22Ne', 1], ['40Ar', 2], ['35Cl', 1]] as const) {
      const iso = isotope(name);
      const ion = iso.massU - q * ELECTRON_MASS_U;
      const r = sectorRadiusM({ massU: ion, charge: q, voltageV: 3000, fieldT: 0.4 });
      const mq = massToChargeInU(massToChargeFromSector({ radiusM: r, fieldT: 0.4, voltageV: 3000 }));
      expect(Math.abs(mq - ion / q)).toBeLessThan(1e-10 * mq);
      const best = identifyIsotope(mq, 1e-4, { maxCharge: 2 })[0];
      expect(`${best.isotope.name}/${best.charge}`).toBe(`${name}/${q}`);
      runs++;
    }
    expect(runs).toBe(4);
    // ⁴⁰Ar and ⁴⁰Ca differ by 2.1e-4 u: a 1e-3 u measurement cannot tell them apart.
    expect(identifyIsotope(39.9618, 1e-3).map((m) => m.isotope.name).sort()).toEqual(['40Ar', '40Ca', '40K']);
  });
});

describe('velocity selector, rigidity, cyclotron frequency, plate deflection (common practice)', () => {
  it('v = E/B; Bρ of 1 GeV/c is 1/0.299792458 T·m; a 100 MeV proton 1.4829 T·m', () => {
    expect(selectedSpeedMPerS({ plateVoltageV: 500, gapM: 0.01, fieldT: 0.01 })).toBeCloseTo(5e6, 6);
    expect(magneticRigidityTm(1)).toBeCloseTo(1 / 0.299792458, 12);
    expect(rigidityFromKineticTm(100, PROTON.massMeV)).toBeCloseTo(Math.sqrt(100 * (100 + 2 * PROTON.massMeV)) / 299.792458, 12);
  });
  it('cyclotron frequency of a slow proton in 1 T is e B/(2π m_p) from CODATA e and m_p (1e-9), and falls as 1/γ', () => {
    const mpKg = PROTON.massMeV * 1e6 * ELEMENTARY_CHARGE_C / 299792458 ** 2;
    expect(Math.abs(cyclotronFrequencyHz(1, PROTON.massMeV) / (ELEMENTARY_CHARGE_C / (2 * Math.PI * mpKg)) - 1)).toBeLessThan(1e-9);
    expect(cyclotronFrequencyHz(1, PROTON.massMeV, 1, PROTON.massMeV)).toBeCloseTo(cyclotronFrequencyHz(1, PROTON.massMeV) / 2, 6);
  });
  it('a slow electron through V_a: deflection V L²/(4 d V_a) at the plates, and (VL/(2dV_a))(L/2 + D) on the screen', () => {
    const d = plateDeflection({ plateVoltageV: 50, gapM: 0.01, lengthM: 0.05, momentumVelocityEV: 2 * 2000, screenDistanceM: 0.2 });
    expect(d.atPlateEndM).toBeCloseTo((50 * 0.05 ** 2) / (4 * 0.01 * 2000), 15);
    expect(d.onScreenM).toBeCloseTo(((50 * 0.05) / (2 * 0.01 * 2000)) * (0.025 + 0.2), 15);
  });
});
