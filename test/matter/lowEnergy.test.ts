import { beforeEach, describe, expect, it } from 'vitest';
import { ALPHA, MUON_MINUS, PION_PLUS, PROTON } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import {
  blochCorrection, csdaRange, heliumEffectiveChargeSquared, lowEnergyFit, massStoppingPower, material,
  nuclearStoppingPower, protonFitStopping, shellCorrectionOverZ, ELEMENTS, stoppingRegime, collisionStoppingPower,
} from '../../lib/matter/index.js';
import { pstarTable } from './pstarTables.js';

const pct = (a: number, b: number) => 100 * (a / b - 1);
beforeEach(() => void consumeWarnings());

/**
 * Measured deviation from NIST PSTAR (SRD 124, ICRU Report 49 tables; test/fixtures/pstar) in
 * per cent, [T MeV, total stopping power, CSDA range], as documented in lib/matter/README.md.
 * Each row is asserted within ±0.03 percentage points of the documented value (re-measured in issue 15:
 * every row sits within 0.005 of its two-decimal value, so a change of 0.04 % anywhere shows), and within the claimed accuracy band of its energy.
 */
const DOCUMENTED: Readonly<Record<string, readonly (readonly [number, number, number])[]>> = {
  water: [[0.01, 0.02, 4.96], [0.05, 0.13, 1.71], [0.08, -0.01, 1.23], [0.1, -0.10, 1.06], [0.15, 0.45, 0.74], [0.2, 0.41, 0.45], [0.3, -0.47, 0.31], [0.4, -0.78, 0.42], [0.5, -0.62, 0.50], [0.7, 0.04, 0.42], [1, 0.59, 0.08], [1.5, 0.87, -0.32], [2, 0.92, -0.54], [3, 0.66, -0.68], [5, 0.22, -0.54], [7, -0.04, -0.32], [10, -0.17, -0.10], [20, -0.08, 0.03], [50, -0.01, 0.02], [100, 0.01, -0.00], [150, 0.01, 0.02], [200, 0.02, -0.01], [500, 0.03, 0.02], [1000, -0.05, -0.00], [2000, -0.46, 0.20], [5000, -0.04, 0.25], [10000, 0.27, 0.06]],
  air: [[0.01, 1.89, 2.94], [0.05, 1.34, 0.11], [0.08, 0.65, -0.18], [0.1, 0.21, -0.26], [0.15, -0.72, -0.09], [0.2, -1.32, 0.18], [0.3, -1.03, 0.60], [0.4, -0.40, 0.62], [0.5, -0.17, 0.56], [0.7, 0.00, 0.39], [1, 0.11, 0.18], [1.5, 0.16, 0.03], [2, 0.07, -0.03], [3, -0.03, -0.04], [5, -0.13, 0.05], [7, -0.14, 0.09], [10, -0.13, 0.12], [20, -0.06, 0.09], [50, -0.03, 0.04], [100, 0.01, 0.00], [200, 0.01, -0.03], [500, 0.03, -0.02], [1000, -0.00, -0.02], [2000, 0.01, -0.01], [5000, 0.00, -0.02], [10000, 0.03, -0.00]],
  aluminium: [[0.01, 0.22, 4.16], [0.05, 0.02, 1.52], [0.08, -0.12, 1.09], [0.1, -0.17, 0.93], [0.15, -0.21, 0.69], [0.2, -0.25, 0.59], [0.3, -0.27, 0.46], [0.4, -0.23, 0.42], [0.5, -0.19, 0.37], [0.7, -0.14, 0.30], [1, 0.00, 0.22], [1.5, 0.12, 0.08], [2, 0.19, -0.04], [3, 0.27, -0.11], [5, 0.00, -0.14], [7, -0.30, -0.01], [10, -0.41, 0.17], [20, -0.20, 0.25], [50, -0.06, 0.11], [100, -0.04, 0.02], [200, -0.02, 0.05], [500, -0.00, -0.01], [1000, 0.19, -0.04], [2000, 0.25, -0.23], [5000, -0.16, -0.11], [10000, -0.13, 0.04]],
  copper: [[0.01, 0.29, -2.90], [0.05, 0.13, -1.23], [0.08, 0.07, -0.93], [0.1, 0.04, -0.79], [0.15, -0.04, -0.58], [0.2, -0.09, -0.42], [0.3, -0.16, -0.25], [0.4, -0.22, -0.15], [0.5, -0.51, -0.06], [0.7, 0.06, 0.07], [1, 0.87, -0.15], [1.5, 0.85, -0.46], [2, 0.61, -0.55], [3, 0.94, -0.66], [5, 0.60, -0.73], [7, 0.13, -0.53], [10, -0.05, -0.33], [20, 0.02, -0.08], [50, 0.11, -0.10], [100, 0.06, -0.06], [200, 0.01, -0.03], [500, 0.11, -0.10], [1000, 0.07, -0.07], [2000, 0.08, -0.05], [5000, 0.03, -0.06], [10000, 0.10, -0.07]],
};

/** Claimed accuracy [%] by band: stopping power and range (README "Validity and accuracy"). */
function claim(t: number): { s: number; r: number } {
  if (t < 0.1) return { s: 2, r: 5 };
  if (t < 1) return { s: 3, r: 3 };
  if (t < 2) return { s: 1, r: 2 };
  return { s: 1, r: 1 };
}

describe('protons against NIST PSTAR, 10 keV – 10 GeV (ICRU 49 fits, join, Bethe with shell and Bloch terms)', () => {
  for (const [name, rows] of Object.entries(DOCUMENTED)) {
    it(`${name}: every row at its documented deviation (±0.03 points) and inside the claimed band`, () => {
      const table = pstarTable(name);
      const m = material(name);
      let checked = 0;
      for (const [t, dS, dR] of rows) {
        const row = table.find((r) => r.t === t)!;
        const s = pct(massStoppingPower(PROTON, m, t), row.total);
        const r = pct(csdaRange(PROTON, m, t), row.range);
        expect(Math.abs(s - dS), `${name} S at ${t} MeV: ${s.toFixed(2)} %`).toBeLessThan(0.03);
        expect(Math.abs(r - dR), `${name} R at ${t} MeV: ${r.toFixed(2)} %`).toBeLessThan(0.03);
        expect(Math.abs(s), `${name} S at ${t} MeV`).toBeLessThan(claim(t).s);
        expect(Math.abs(r), `${name} R at ${t} MeV`).toBeLessThan(claim(t).r);
        checked++;
      }
      expect(checked).toBe(rows.length);
      expect(consumeWarnings()).toEqual([]);
    });
  }
});

describe('the pieces, each against its published form', () => {
  it('the ICRU 49 water fit reproduces PSTAR electronic stopping at 10–150 keV within 0.4 %', () => {
    const fit = lowEnergyFit(material('water'))!;
    const rows = pstarTable('water').filter((r) => r.t >= 0.01 && r.t <= 0.15);
    for (const r of rows) expect(Math.abs(pct(protonFitStopping(fit, r.t), r.electronic)), `${r.t} MeV`).toBeLessThan(0.4);
    expect(rows.length).toBe(5);
  });
  it('nuclear stopping (ZBL universal) is 15 % below PSTAR at 10 keV in water and tiny (< 0.1 % of S) above 1 MeV', () => {
    // PSTAR water S_nuc: 10.00 at 10 keV; 0.2173 at 1 MeV (test/fixtures/pstar/water.txt).
    const w = material('water');
    expect(pct(nuclearStoppingPower(PROTON, w, 0.01), 10.0)).toBeGreaterThan(-18);
    expect(pct(nuclearStoppingPower(PROTON, w, 0.01), 10.0)).toBeLessThan(-12);
    expect(nuclearStoppingPower(PROTON, w, 1) / massStoppingPower(PROTON, w, 1)).toBeLessThan(1e-3);
  });
  it('the Bloch term is −1.20206 y² for small y and the shell correction falls with βγ (Barkas–Berger)', () => {
    // PDG RPP: L_Bloch → −ζ(3) y², y = zα/β; ζ(3) = 1.2020569 (common practice).
    const y = 7.2973525693e-3 / 0.5;
    expect(blochCorrection(1, 0.5) / (-1.20206 * y * y)).toBeCloseTo(1, 3);
    expect(blochCorrection(2, 0.5) / blochCorrection(1, 0.5)).toBeCloseTo(4, 1);
    const al = ELEMENTS.Al;
    expect(shellCorrectionOverZ(al, 0.2)).toBeGreaterThan(shellCorrectionOverZ(al, 1));
    expect(shellCorrectionOverZ(al, 1)).toBeGreaterThan(0);
  });
  it('the ZBL helium effective charge: z_eff² ≈ 2.7 at 0.1 MeV/u and → 4 above 2 MeV/u', () => {
    expect(heliumEffectiveChargeSquared(ALPHA.massMeV, 0.4, 8)).toBeCloseTo(2.73, 1);
    expect(heliumEffectiveChargeSquared(ALPHA.massMeV, 8, 8)).toBeGreaterThan(3.99);
  });
  it('stoppingRegime names the regime: fit, join, bethe; extrapolated where no fit exists', () => {
    const w = material('water');
    expect([0.05, 1, 50].map((t) => stoppingRegime(PROTON, w, t))).toEqual(['fit', 'join', 'bethe']);
    expect(stoppingRegime(PROTON, material('lead'), 0.5)).toBe('extrapolated');
    expect(stoppingRegime(ALPHA, w, 0.5)).toBe('fit');
    expect(stoppingRegime(PROTON, material('lead'), 50)).toBe('extrapolated');
    expect(stoppingRegime(PROTON, material('silicon'), 50)).toBe('bethe');
    expect(stoppingRegime(MUON_MINUS, w, 1)).toBe('bethe');
  });
  it('heavy particles scale by velocity: a pion and a proton of the same βγ in the fit region differ by z² = 1 only', () => {
    const w = material('water');
    const tp = 0.05, tpi = (tp * PION_PLUS.massMeV) / PROTON.massMeV;
    expect(collisionStoppingPower(PION_PLUS, w, tpi)).toBeCloseTo(collisionStoppingPower(PROTON, w, tp), 9);
  });
  it('a material without a fit warns APPROXIMATION below the proton-equivalent 2 MeV, and not above', () => {
    massStoppingPower(PROTON, material('silicon'), 5);
    expect(consumeWarnings()).toEqual([]);
    massStoppingPower(PROTON, material('silicon'), 0.5);
    expect(consumeWarnings().map((w) => w.code)).toEqual(['APPROXIMATION']);
  });
});

/**
 * Materials without an ICRU 49 fit, against PSTAR (test/fixtures/pstar/silicon.txt, lead.txt):
 * the documented deviations [T, S %, R %] of the scaled-reference extrapolation below 2 MeV and,
 * for lead, of the Barkas–Berger shell correction below 100 MeV. Asserted at ±0.03 points (values re-measured to 0.005, issue 15).
 */
const NO_FIT: Readonly<Record<string, readonly (readonly [number, number, number])[]>> = {
  silicon: [[0.01, -9.88, 14.91], [0.1, -9.74, 12.87], [0.3, 0.36, 6.28], [1, 0.06, 1.03], [2, 0.13, 0.24], [10, -0.32, 0.15], [100, -0.01, 0.03], [1000, 0.18, -0.04]],
  lead: [[0.01, 13.87, -14.97], [0.1, -13.58, -4.20], [0.3, -15.10, 9.42], [1, -4.98, 7.49], [2, -11.19, 8.70], [20, -4.35, 3.57], [100, -0.55, 1.80], [200, -0.03, 0.69], [1000, 0.28, -0.17]],
};

describe('materials without a low-energy fit (stated approximations, asserted at their documented deviation)', () => {
  for (const [name, rows] of Object.entries(NO_FIT)) {
    it(`${name}: PSTAR deviations as documented, warned as APPROXIMATION where extrapolated`, () => {
      const table = pstarTable(name);
      const m = material(name);
      for (const [t, dS, dR] of rows) {
        const row = table.find((r) => r.t === t)!;
        expect(Math.abs(pct(massStoppingPower(PROTON, m, t), row.total) - dS), `${name} S at ${t}`).toBeLessThan(0.03);
        expect(Math.abs(pct(csdaRange(PROTON, m, t), row.range) - dR), `${name} R at ${t}`).toBeLessThan(0.03);
      }
      const codes = new Set(consumeWarnings().map((w) => w.code));
      expect([...codes]).toEqual(['APPROXIMATION']);
    });
  }
});

describe('alphas (ICRU 49 helium fits, ZBL effective charge)', () => {
  it('a 5.3 MeV alpha travels 3.9–4.0 cm in air (common practice) — 3.91 cm here', () => {
    const air = material('air');
    const cm = csdaRange(ALPHA, air, 5.3) / air.densityGcm3;
    expect(cm).toBeGreaterThan(3.85);
    expect(cm).toBeLessThan(4.0);
  });
  it('alpha stopping is continuous across the helium join in water and air (no step above 0.5 %)', () => {
    for (const name of ['water', 'air']) {
      const m = material(name);
      const fit = lowEnergyFit(m)!;
      for (const t of [fit.helium.joinLowMeV, fit.helium.joinHighMeV]) {
        const a = massStoppingPower(ALPHA, m, t * 0.9999), b = massStoppingPower(ALPHA, m, t * 1.0001);
        expect(Math.abs(a / b - 1), `${name} at ${t}`).toBeLessThan(5e-3);
      }
    }
  });
  it('an alpha in lead (no helium fit) uses z_eff² times the proton value at the same velocity', () => {
    const pb = material('lead');
    const t = 2;
    const ratio = massStoppingPower(ALPHA, pb, t) / massStoppingPower(PROTON, pb, (t * PROTON.massMeV) / ALPHA.massMeV);
    expect(ratio).toBeGreaterThan(3.3);
    expect(ratio).toBeLessThan(4);
    consumeWarnings();
  });
});
