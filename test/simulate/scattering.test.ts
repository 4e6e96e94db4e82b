import { describe, expect, it } from 'vitest';
import { material } from '../../lib/matter/index.js';
import { MUON_MINUS, PROTON } from '../../lib/particles.js';
import { chamber, seededRandom, transportTrack, TRANSPORT_DEFAULTS } from '../../lib/simulate/index.js';
import { chamberMedium } from '../../lib/matter/index.js';
import { highlandTheta0, radiationLengthM } from '../../lib/matter/highland.js';

/**
 * Statistical checks with fixed seeds. The θ₀ fed to the transport is Highland–Lynch–Dahl
 * (PDG RPP, "Passage of particles through matter", multiple scattering), evaluated by
 * lib/track's `highlandTheta0`. The simulator draws Gaussian projected angles of that width, so
 * the RMS of the projected angle must match θ₀ within its statistical error (1/√(2N) relative).
 */
function projectedAngles(steps: number, stepM: number, pGeV: number, n: number, seed: number): Float64Array {
  const lh2 = chamberMedium('liquid hydrogen');
  const box = chamber({ sizeM: [10, 10, 10], medium: lh2, fieldT: [0, 0, 0] });
  const rng = seededRandom(seed);
  const opts = { ...TRANSPORT_DEFAULTS, energyLoss: 'off' as const, scattering: true, maxStepM: stepM, maxPathM: steps * stepM * (1 - 1e-12), sampling: { kind: 'spacing' as const, spacingM: 100 } };
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const end = transportTrack({ species: MUON_MINUS, xM: 0, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: pGeV }, box, opts, rng, () => {});
    out[i] = Math.atan2(end.uy, end.ux);
  }
  return out;
}

const rms = (a: Float64Array) => Math.sqrt(a.reduce((s, v) => s + v * v, 0) / a.length);

describe('multiple scattering in the simulator reproduces the Highland θ₀ it was fed', () => {
  const lh2 = material('liquid hydrogen');
  const x0 = radiationLengthM(lh2);
  const p = 0.3;
  const beta = p / Math.hypot(p, MUON_MINUS.massMeV / 1000);

  it('one 5 cm step of liquid hydrogen, 0.3 GeV/c μ⁻: RMS projected angle = θ₀ within 3 % (N = 20 000; 1σ stat 0.5 %)', () => {
    const n = 20000;
    const angles = projectedAngles(1, 0.05, p, n, 11);
    const theta0 = highlandTheta0({ momentumGeV: p, beta, charge: -1, thicknessOverX0: 0.05 / x0 });
    expect(theta0).toBeGreaterThan(0.002);
    expect(Math.abs(rms(angles) / theta0 - 1)).toBeLessThan(0.03);
    // Gaussian shape: 68.27 % within ±θ₀ (normal distribution), within 1.5 % absolute.
    const inside = angles.reduce((c, v) => c + (Math.abs(v) < theta0 ? 1 : 0), 0) / n;
    expect(Math.abs(inside - 0.6827)).toBeLessThan(0.015);
  });

  it('twenty 1 cm steps: the accumulated RMS equals Highland for the whole 20 cm within 3 % (not √20 × the 1 cm value, which is ~13 % low)', () => {
    const angles = projectedAngles(20, 0.01, p, 10000, 12);
    const whole = highlandTheta0({ momentumGeV: p, beta, charge: -1, thicknessOverX0: 0.2 / x0 });
    const perStep = highlandTheta0({ momentumGeV: p, beta, charge: -1, thicknessOverX0: 0.01 / x0 });
    expect(Math.abs(rms(angles) / whole - 1)).toBeLessThan(0.03);
    expect(Math.sqrt(20) * perStep / whole).toBeLessThan(0.9);
  });

  it('the step increments telescope: Σ Δθ₀² over any split equals θ₀² of the whole path; short steps give finite values', () => {
    const loss = chamberMedium('liquid hydrogen').forSpecies(PROTON);
    let sum = 0;
    for (let k = 0; k < 50; k++) sum += loss.theta0Rad(1, 0.73, 0.004, 0.004 * k) ** 2;
    expect(Math.sqrt(sum) / loss.theta0Rad(1, 0.73, 0.2, 0)).toBeCloseTo(1, 12);
    expect(loss.theta0Rad(1, 0.73, 0.2, 0)).toBeCloseTo(highlandTheta0({ momentumGeV: 1, beta: 0.73, charge: 1, thicknessOverX0: 0.2 / x0 }), 14);
    expect(Number.isFinite(loss.theta0Rad(1, 0.73, 1e-6, 0))).toBe(true);
  });
});
