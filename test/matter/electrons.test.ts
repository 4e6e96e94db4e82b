import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { beforeEach, describe, expect, it } from 'vitest';
import { ELECTRON, POSITRON } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { collisionStoppingPower, csdaRange, material, radiativeStoppingPower } from '../../lib/matter/index.js';
import { radiativeDirect } from '../../lib/matter/electronLoss.js';

const pct = (a: number, b: number) => 100 * (a / b - 1);
beforeEach(() => void consumeWarnings());

function estar(name: string): number[][] {
  const text = readFileSync(fileURLToPath(new URL(`../fixtures/estar/${name}.txt`, import.meta.url)), 'utf8');
  return text.split('\n').filter((l) => l.trim() && !l.startsWith('#')).map((l) => l.trim().split(/\s+/).map(Number));
}

/**
 * Measured deviation from NIST ESTAR (SRD 124 / ICRU 37; test/fixtures/estar) in per cent,
 * [T MeV, collision, radiative, CSDA range], documented in lib/matter/README.md. Each row is
 * asserted within ±0.05 points of its documented value (issue 15: the four printed ESTAR digits
 * round to ≤ 0.05 %, the radiative table interpolates to 0.03 %; the values are re-measured).
 */
const DOCUMENTED: Readonly<Record<string, readonly (readonly [number, number, number, number])[]>> = {
  water: [[0.01, 0.01, -8.87, -0.75], [0.02, 0.04, -8.64, -0.22], [0.05, 0.00, -5.11, -0.05], [0.1, 0.01, -1.47, -0.03], [0.2, 0.00, 1.29, -0.02], [0.5, 0.01, -1.29, -0.03], [1, -0.50, 6.39, 0.20], [2, -0.30, 5.98, 0.28], [5, 0.27, 2.80, 0.01], [10, 0.37, 1.12, -0.21], [20, 0.22, 0.12, -0.26], [50, 0.06, 0.07, -0.16], [100, 0.04, 0.41, -0.16], [200, -0.00, 0.80, -0.23], [500, 0.01, 1.16, -0.44], [1000, 0.02, 1.39, -0.62]],
  air: [[0.01, 0.01, -8.59, -0.84], [0.02, 0.01, -8.18, -0.25], [0.05, 0.01, -4.70, -0.06], [0.1, -0.00, -1.05, 0.01], [0.2, 0.02, 1.51, -0.00], [0.5, -0.01, -0.79, 0.02], [1, -0.01, 6.97, -0.02], [2, 0.03, 6.59, -0.04], [5, 0.00, 3.41, -0.11], [10, 0.01, 1.65, -0.12], [20, 0.02, 0.55, -0.12], [50, -0.24, 0.41, -0.02], [100, 0.10, 0.69, -0.10], [200, 0.30, 0.97, -0.27], [500, 0.12, 1.24, -0.49], [1000, 0.00, 1.40, -0.65]],
};

describe('electrons against NIST ESTAR, 10 keV – 1 GeV', () => {
  for (const [name, rows] of Object.entries(DOCUMENTED)) {
    it(`${name}: collision, radiative and CSDA range at their documented deviations; collision and range within 1 %, radiative within 2 % from 10 MeV up`, () => {
      const table = estar(name);
      const m = material(name);
      let checked = 0;
      for (const [t, dC, dR, dRange] of rows) {
        const row = table.find((r) => r[0] === t)!;
        const c = pct(collisionStoppingPower(ELECTRON, m, t), row[1]);
        const r = pct(radiativeStoppingPower(ELECTRON, m, t), row[2]);
        const rg = pct(csdaRange(ELECTRON, m, t), row[4]);
        expect(Math.abs(c - dC), `${name} S_col at ${t}: ${c.toFixed(3)}`).toBeLessThan(0.05);
        expect(Math.abs(r - dR), `${name} S_rad at ${t}: ${r.toFixed(3)}`).toBeLessThan(0.05);
        expect(Math.abs(rg - dRange), `${name} R at ${t}: ${rg.toFixed(3)}`).toBeLessThan(0.05);
        expect(Math.abs(c)).toBeLessThan(1);
        expect(Math.abs(rg)).toBeLessThan(1);
        if (t >= 10) expect(Math.abs(r), `${name} S_rad at ${t}`).toBeLessThan(2);
        checked++;
      }
      expect(checked).toBe(rows.length);
    });
  }
  it('the tabulated radiative term matches the direct integral within 3e-4 between nodes', () => {
    const w = material('water');
    let checked = 0;
    for (const t of [0.0137, 0.333, 4.44, 77.7, 901]) {
      expect(Math.abs(radiativeStoppingPower(ELECTRON, w, t) / radiativeDirect(w, t) - 1), `${t} MeV`).toBeLessThan(3e-4);
      checked++;
    }
    expect(checked).toBe(5);
  });
  it('at high energy the radiative loss approaches E/X₀ (complete screening, PDG definition of X₀): lead at 10 GeV is +1.38 % (±0.05 points)', () => {
    // X₀(Pb) = 6.37 g/cm² (PDG, memory). Measured +1.38 %: the Bethe–Heitler loss includes the
    // y² term that the X₀ definition (dE/dx = E/X₀) leaves out at the 1–2 % level (PDG RPP).
    const e = 10_000 + 0.51099895;
    expect(Math.abs(100 * (radiativeStoppingPower(ELECTRON, material('lead'), 10_000) / (e / 6.37) - 1) - 1.38)).toBeLessThan(0.05);
    expect(radiativeStoppingPower(POSITRON, material('lead'), 1000)).toBe(radiativeStoppingPower(ELECTRON, material('lead'), 1000));
  });
  it('positrons differ from electrons by the Bhabha − Møller functions only (ICRU 37 eq. 2.2): S⁺ − S⁻ = (K/2)⟨Z/A⟩/β² (F⁺ − F⁻)', () => {
    // F⁻ = 1 − β² + [τ²/8 − (2τ+1) ln2]/(τ+1)², F⁺ = 2 ln2 − (β²/12)[23 + 14/(τ+2) + 10/(τ+2)² + 4/(τ+2)³]
    // (ICRU Report 37; memory), K = 0.307075 MeV cm²/mol (PDG), water ⟨Z/A⟩ = 0.55509.
    const w = material('water');
    let checked = 0;
    for (const t of [0.01, 0.1, 1, 10, 1000]) {
      const tau = t / 0.51099895, g = tau + 1, b2 = 1 - 1 / (g * g), y = tau + 2;
      const fm = 1 - b2 + ((tau * tau) / 8 - (2 * tau + 1) * Math.LN2) / (g * g);
      const fp = 2 * Math.LN2 - (b2 / 12) * (23 + 14 / y + 10 / y ** 2 + 4 / y ** 3);
      const expected = ((0.307075 / 2) * 0.55509 / b2) * (fp - fm);
      const diff = collisionStoppingPower(POSITRON, w, t) - collisionStoppingPower(ELECTRON, w, t);
      expect(diff / expected, `${t} MeV`).toBeCloseTo(1, 5);
      checked++;
    }
    expect(checked).toBe(5);
  });
  it('collision and radiative terms are NaN with a warning outside 10 keV – 10 GeV, and finite at both ends', () => {
    const w = material('water');
    for (const t of [0.01, 10_000]) {
      expect(Number.isFinite(collisionStoppingPower(ELECTRON, w, t)), `${t}`).toBe(true);
      expect(Number.isFinite(radiativeStoppingPower(ELECTRON, w, t)), `${t}`).toBe(true);
    }
    expect(consumeWarnings()).toEqual([]);
    expect(collisionStoppingPower(ELECTRON, w, 10_001)).toBeNaN();
    expect(radiativeStoppingPower(ELECTRON, w, 0.0099)).toBeNaN();
    const warned = consumeWarnings();
    expect(warned.map((x) => x.source)).toEqual(['electronCollisionStoppingPower', 'electronRadiativeStoppingPower']);
    expect(warned[1].message).toBe('electronRadiativeStoppingPower: electron at T = 0.0099 MeV is outside the validity range 0.01–10000 MeV; result is NaN');
  });
});
