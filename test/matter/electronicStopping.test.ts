import { beforeEach, describe, expect, it } from 'vitest';
import { ALPHA, ANTIPROTON, DEUTERON, MUON_MINUS, PROTON, type Particle } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { collisionStoppingPower, heliumEffectiveChargeSquared, lowEnergyFit, material, stoppingRegime } from '../../lib/matter/index.js';

// The ICRU 49 scheme of lib/matter/electronicStopping.ts: its joins, velocity scaling, the
// stopping-ratio extrapolation and the helium effective-charge branch. PSTAR row by row is in
// lowEnergy.test.ts; here the structure that a wrong number in the scheme would break.

beforeEach(() => void consumeWarnings());
const MP = 938.27208816; // proton rest energy [MeV] (PDG / CODATA 2018)
const MA = 3727.3794066; // alpha rest energy [MeV] (CODATA 2018)

describe('the fit–Bethe joins are C¹ (value and slope continuous, ICRU 49 scheme as documented)', () => {
  // Measured: the value steps by ≤ 1.6e-7 over ±1e-7 in T (the slope itself), the log-slopes
  // either side agree to ≤ 0.002 over ±0.2 %.
  for (const name of ['water', 'air', 'aluminium', 'copper']) {
    it(`${name}: proton and alpha joins`, () => {
      let checked = 0;
      const m = material(name);
      const f = lowEnergyFit(m)!;
      for (const [p, c] of [[PROTON, f.proton], [ALPHA, f.helium]] as const) {
        for (const t of [c.joinLowMeV, c.joinHighMeV]) {
          const s = (x: number) => collisionStoppingPower(p, m, x);
          expect(Math.abs(s(t * (1 + 1e-7)) / s(t * (1 - 1e-7)) - 1), `${name} ${p.name} value at ${t}`).toBeLessThan(2e-7);
          const below = Math.log(s(t) / s(t * (1 - 2e-3))) / -Math.log(1 - 2e-3);
          const above = Math.log(s(t * (1 + 2e-3)) / s(t)) / Math.log(1 + 2e-3);
          expect(Math.abs(below - above), `${name} ${p.name} slope at ${t}`).toBeLessThan(2e-3);
          checked++;
        }
      }
      expect(checked).toBe(4);
    });
  }
  it('the regimes switch at the join energies (water: proton 0.1 / 4 MeV, alpha 0.6 / 16 MeV; fit at the lower edge, bethe from the upper)', () => {
    const w = material('water');
    expect([0.1, 0.1001, 3.999, 4].map((t) => stoppingRegime(PROTON, w, t))).toEqual(['fit', 'join', 'join', 'bethe']);
    expect([0.6, 0.6001, 15.99, 16].map((t) => stoppingRegime(ALPHA, w, t))).toEqual(['fit', 'join', 'join', 'bethe']);
    // A deuteron takes the proton regime at the same velocity (T_p = T · m_p/m_d).
    expect(stoppingRegime(DEUTERON, w, 0.1 * DEUTERON.massMeV / MP)).toBe('fit');
    expect(stoppingRegime(DEUTERON, w, 4.0001 * DEUTERON.massMeV / MP)).toBe('bethe');
  });
});

describe('velocity scaling and charge', () => {
  const w = material('water');
  it('an antiproton loses exactly what a proton loses at every energy (z², |z| in the Bloch term; no Barkas term, as documented)', () => {
    let checked = 0;
    for (const t of [0.01, 0.5, 3, 50, 5000]) {
      expect(collisionStoppingPower(ANTIPROTON, w, t), `${t} MeV`).toBe(collisionStoppingPower(PROTON, w, t));
      checked++;
    }
    expect(checked).toBe(5);
  });
  it('a deuteron at the proton’s velocity: equal in the fit region, within the T_max and L difference above (≤ 1.5e-4)', () => {
    // Measured: 0 in the fit, +1.1e-4 (join), +6e-5 / +4e-5 (Bethe at 3, 50 MeV), +1.5e-4 at 5 GeV.
    const documented: [number, number][] = [[0.01, 0], [0.5, 1.06e-4], [3, 6.2e-5], [50, 3.98e-5], [5000, 1.476e-4]];
    for (const [tp, d] of documented) {
      const r = collisionStoppingPower(DEUTERON, w, (tp * DEUTERON.massMeV) / MP) / collisionStoppingPower(PROTON, w, tp) - 1;
      expect(Math.abs(r - d), `T_p = ${tp}`).toBeLessThan(5e-6);
    }
  });
  it('a helium-3 ion (z = 2, not the alpha mass) uses the effective charge × proton stopping: 1.6 % below an α at the same velocity in water at 1 MeV α', () => {
    // ³He mass 2808.39160743 MeV (CODATA 2018). Measured −1.622 %: the α takes the ICRU 49 helium fit instead.
    const he3: Particle = { name: 'helion', symbol: 'h', massMeV: 2808.39160743, charge: 2, ctauM: Infinity };
    const r = collisionStoppingPower(he3, w, (1 * he3.massMeV) / MA) / collisionStoppingPower(ALPHA, w, 1) - 1;
    expect(Math.abs(r + 0.01622)).toBeLessThan(2e-4);
    // An "alpha" 0.5 MeV off the alpha mass still counts as one (tolerance 1 MeV): same as the α at equal velocity.
    const nearAlpha: Particle = { ...ALPHA, name: 'alpha-like', massMeV: MA + 0.5 };
    expect(collisionStoppingPower(nearAlpha, w, (1 * nearAlpha.massMeV) / MA) / collisionStoppingPower(ALPHA, w, 1)).toBeCloseTo(1, 6);
  });
  it('a muon in the Bethe region differs from a proton at the same βγ only through T_max (½ ln of the ratio)', () => {
    // PDG RPP: S ∝ L with L containing ½ ln T_max; at βγ = 3 the two T_max differ by (1 + 2γ m_e/M + (m_e/M)²).
    const bg = 3, g = Math.sqrt(1 + bg * bg);
    const tmax = (m: number) => (2 * 0.51099895 * bg * bg) / (1 + (2 * g * 0.51099895) / m + (0.51099895 / m) ** 2);
    const tm = 105.6583755 * (g - 1), tp = MP * (g - 1);
    const diff = collisionStoppingPower(MUON_MINUS, w, tm) - collisionStoppingPower(PROTON, w, tp);
    const pref = (0.307075 * 0.55509 * (1 + bg * bg)) / (bg * bg);
    expect(diff / (pref * 0.5 * Math.log(tmax(105.6583755) / tmax(MP)))).toBeCloseTo(1, 4);
  });
});

describe('materials without a fit', () => {
  it('silicon below 2 MeV is aluminium’s curve (nearest in ln I: 173 vs 166 eV) times S_Si/S_Al at 2 MeV: a constant 1.020362', () => {
    const si = material('silicon'), al = material('aluminium');
    let checked = 0;
    for (const t of [0.01, 0.1, 0.5, 1.5, 2]) {
      expect(collisionStoppingPower(PROTON, si, t) / collisionStoppingPower(PROTON, al, t), `${t} MeV`).toBeCloseTo(1.0203618, 7);
      checked++;
    }
    expect(checked).toBe(5);
    // Continuous at 2 MeV (the scale is the ratio of the Bethe values there); above, Bethe for both.
    expect(collisionStoppingPower(PROTON, si, 2.000001) / collisionStoppingPower(PROTON, si, 2)).toBeCloseTo(1, 5);
    expect(collisionStoppingPower(PROTON, si, 3) / collisionStoppingPower(PROTON, al, 3)).toBeCloseTo(1.022454, 5);
    expect(new Set(consumeWarnings().map((x) => x.code))).toEqual(new Set(['APPROXIMATION']));
  });
  it('lead (I = 823 eV > 400) is reported extrapolated up to 100 MeV proton-equivalent, Bethe from there', () => {
    const pb = material('lead');
    expect([1, 2, 99.99, 100].map((t) => stoppingRegime(PROTON, pb, t))).toEqual(['extrapolated', 'extrapolated', 'extrapolated', 'bethe']);
    expect(stoppingRegime(MUON_MINUS, pb, (99.99 * 105.6583755) / MP)).toBe('extrapolated');
    expect(stoppingRegime(PROTON, material('silicon'), 1.999)).toBe('extrapolated');
    expect(stoppingRegime(PROTON, material('silicon'), 2)).toBe('bethe');
  });
  it('an α in lead (no helium fit) below 2 MeV/u: z_eff² S_p × the Bloch ratio; it meets Bethe at 2 MeV/u with a measured 0.32 % step', () => {
    // The module note says the factor makes it meet Bethe (z = 2) there; the ZBL z_eff² is 1.022 × 4γ²
    // at 2 MeV/u (its Z₂ term peaks at ln E = 7.6), so a step of +0.316 % remains (issue 15, measured).
    const pb = material('lead');
    const tRef = (8 * MA) / MP;
    const step = collisionStoppingPower(ALPHA, pb, tRef * (1 - 1e-9)) / collisionStoppingPower(ALPHA, pb, tRef * (1 + 1e-9)) - 1;
    expect(Math.abs(step - 0.003162)).toBeLessThan(5e-5);
    // Below: the effective charge (Z₂ = 82) times the proton value at the same velocity, times one
    // constant factor L_α/(L_α − L_Bloch(2) + L_Bloch(1)) taken at 2 MeV/u: measured 0.995981 at every energy.
    let checked = 0;
    for (const t of [0.5, 2, 10, 30]) {
      const ratio = collisionStoppingPower(ALPHA, pb, t) / (heliumEffectiveChargeSquared(MA, t, 82) * collisionStoppingPower(PROTON, pb, (t * MP) / MA));
      expect(ratio, `${t} MeV`).toBeCloseTo(0.995981, 6);
      checked++;
    }
    expect(checked).toBe(4);
    consumeWarnings();
  });
  it('in a compound without a fit the effective charge takes the electron-weighted mean Z: polystyrene (CH)ₙ ⟨Z⟩ = (6·36 + 1)/(6 + 1)·… = 296/56', () => {
    // Per C₈H₈: electrons 8·6 + 8·1 = 56, Σ Z² per electron 8·36 + 8·1 = 296 (common practice). With that
    // Z₂ the ratio to z_eff² S_p is one constant (measured 0.997944) at every energy; another ⟨Z⟩ would make it drift.
    const ps = material('polystyrene');
    let checked = 0;
    for (const t of [0.5, 2, 10, 30]) {
      const ratio = collisionStoppingPower(ALPHA, ps, t) / (heliumEffectiveChargeSquared(MA, t, 296 / 56) * collisionStoppingPower(PROTON, ps, (t * MP) / MA));
      expect(ratio, `${t} MeV`).toBeCloseTo(0.997944, 6);
      checked++;
    }
    expect(checked).toBe(4);
    consumeWarnings();
  });
});
