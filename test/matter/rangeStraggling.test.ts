import { describe, expect, it } from 'vitest';
import { cachedRange } from '../../lib/matter/rangeIntegral.js';
import { csdaRange } from '../../lib/matter/range.js';
import { material } from '../../lib/matter/materials.js';
import { rangeStragglingGcm2, rangeStragglingVariances, varianceAtKinetic } from '../../lib/matter/rangeStraggling.js';
import { ALPHA, ELECTRON, MUON_MINUS, PROTON } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';

describe('rangeStragglingGcm2 (Bohr, with the relativistic factor, integrated over the CSDA table)', () => {
  it('protons in water against the published fit σ_R = 0.012 R^0.935 cm (Bortfeld, Med. Phys. 24 (1997) 2024, eq. 18; memory): 6–8 % above it', () => {
    const water = material('water');
    // Documented deviation: the fit summarises tables that include shell corrections to the
    // straggling (smaller than Bohr's at low energy); ours is Bohr's formula throughout.
    const expected: Record<number, number> = { 100: 1.061, 150: 1.072, 200: 1.076 };
    for (const [t, ratio] of Object.entries(expected)) {
      const T = Number(t), R = csdaRange(PROTON, water, T);
      const published = 0.012 * R ** 0.935;
      expect(rangeStragglingGcm2(PROTON, water, T) / published).toBeCloseTo(ratio, 2);
    }
    // About 1.1 % of the range at 100–200 MeV (the usual rule of thumb for protons in water: common practice).
    const r150 = rangeStragglingGcm2(PROTON, water, 150) / csdaRange(PROTON, water, 150);
    expect(r150).toBeGreaterThan(0.0105);
    expect(r150).toBeLessThan(0.0110);
  });

  it('scales as √(M_p/M) at equal velocity (Bohr: σ_R/R ∝ (mₑ/M)^½ for one stopping law, common practice)', () => {
    const water = material('water');
    for (const gamma of [1.05, 1.2]) {
      const tp = (gamma - 1) * PROTON.massMeV, tm = (gamma - 1) * MUON_MINUS.massMeV;
      const rp = rangeStragglingGcm2(PROTON, water, tp) / csdaRange(PROTON, water, tp);
      const rm = rangeStragglingGcm2(MUON_MINUS, water, tm) / csdaRange(MUON_MINUS, water, tm);
      expect(rm / rp).toBeCloseTo(Math.sqrt(938.27208816 / 105.6583755), 2);
    }
  });

  it('α against p at equal velocity: σ_R/R in the ratio √(M_p/M_α), the charge cancelling (z² in the variance, z⁻² in S², z⁻² in R)', () => {
    const water = material('water');
    for (const gamma of [1.02, 1.2]) {
      const tp = (gamma - 1) * PROTON.massMeV, ta = (gamma - 1) * ALPHA.massMeV;
      const rp = rangeStragglingGcm2(PROTON, water, tp) / csdaRange(PROTON, water, tp);
      const ra = rangeStragglingGcm2(ALPHA, water, ta) / csdaRange(ALPHA, water, ta);
      // 0.5013 and 0.5017 against 0.50172: the helium stopping law is z² times the proton's only to ≈ 0.1 % here.
      expect(ra / rp / Math.sqrt(938.27208816 / 3727.3794066)).toBeCloseTo(1, 2);
    }
  });

  it('interpolates linearly in ln T between its nodes at any energy (against a search written here)', () => {
    const propane = material('liquid-propane');
    const table = cachedRange(PROTON, propane);
    const v = rangeStragglingVariances(table, PROTON, propane);
    const t = table.kineticEnergyMeV;
    const rng = seededRandom(2, 'straggling');
    for (let k = 0; k < 400; k++) {
      const T = t[0] * (t[t.length - 1] / t[0]) ** rng.uniform();
      let i = 0;
      while (t[i + 1] <= T) i++;
      const u = Math.log(T / t[i]) / Math.log(t[i + 1] / t[i]);
      expect(varianceAtKinetic(table, v, T) / (v[i] + u * (v[i + 1] - v[i])) - 1).toBeCloseTo(0, 11);
    }
  });

  it('grows with energy from 0 at the table\'s low cutoff, interpolates in ln T, and refuses e± and bad energies', () => {
    const propane = material('liquid-propane');
    const table = cachedRange(PROTON, propane);
    const v = rangeStragglingVariances(table, PROTON, propane);
    expect(v[0]).toBe(0);
    for (let i = 1; i < v.length; i++) expect(v[i]).toBeGreaterThan(v[i - 1]);
    expect(rangeStragglingGcm2(PROTON, propane, 0)).toBe(0);
    expect(varianceAtKinetic(table, v, table.kineticEnergyMeV[0] / 2)).toBe(0);
    // Between nodes: linear in ln T.
    const t1 = table.kineticEnergyMeV[100], t2 = table.kineticEnergyMeV[101], mid = Math.sqrt(t1 * t2);
    expect(varianceAtKinetic(table, v, mid)).toBeCloseTo((v[100] + v[101]) / 2, 12);
    expect(varianceAtKinetic(table, v, 1e9)).toBe(v[v.length - 1]);
    expect([varianceAtKinetic(table, v, 0), varianceAtKinetic(table, v, -5), varianceAtKinetic(table, v, NaN)]).toEqual([0, 0, NaN]);
    expect(() => rangeStragglingVariances(cachedRange(ELECTRON, propane), ELECTRON, propane)).toThrow('particle = "electron" is not valid: expected a heavy charged particle (μ or heavier): the range of e± is not Gaussian');
    expect(() => rangeStragglingGcm2(PROTON, propane, -1)).toThrow('kineticMeV = -1 is not valid: expected a finite kinetic energy ≥ 0 in MeV');
    expect(() => rangeStragglingGcm2(PROTON, propane, NaN)).toThrow(/kineticMeV = NaN is not valid/);
    expect(() => rangeStragglingGcm2(PROTON, propane, Infinity)).toThrow(/kineticMeV = Infinity is not valid/);
  });
});
