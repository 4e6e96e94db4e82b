import { describe, expect, it } from 'vitest';
import { fitCircles } from '../../lib/fit/fitCircles.js';
import { fitHelices } from '../../lib/fit/fitHelices.js';
import { momenta, momentumAt, transverseMomentumGeV, radiusOfCurvatureM } from '../../lib/track/momentum.js';
import { GEV_PER_TESLA_METRE, SPEED_OF_LIGHT_M_S } from '../../lib/constants.js';
import { allocateCircleFits } from '../../lib/fit/circleFit.js';
import { arc, gaussian } from '../fit/helpers.js';

describe('transverseMomentumGeV: p_T = 0.299792458·|z|·B·R (common practice; c exact, CODATA 2018)', () => {
  it('the constant is c/1e9 with c = 299 792 458 m/s exactly', () => {
    expect(SPEED_OF_LIGHT_M_S).toBe(299_792_458);
    expect(GEV_PER_TESLA_METRE).toBeCloseTo(0.299792458, 15);
  });
  it('R = 2 m in 1.5 T → 0.899377374 GeV/c; an alpha (|z| = 2) on the same radius has twice that', () => {
    expect(transverseMomentumGeV(1.5, 2)).toBeCloseTo(0.899377374, 12);
    expect(transverseMomentumGeV(1.5, 2, 2)).toBeCloseTo(1.798754748, 12);
    expect(radiusOfCurvatureM(0.899377374, 1.5)).toBeCloseTo(2, 9);
    expect(radiusOfCurvatureM(1.798754748, 1.5, 2)).toBeCloseTo(2, 9);
  });
});

/** A hand-built arc of radius R travelled clockwise or counter-clockwise (seen from +z). */
function trackOn(R: number, clockwise: boolean) {
  const a = arc(0, 0, R, Math.PI / 2, clockwise ? -0.7 : 0.7, 25);
  return fitCircles({ x: a.x, y: a.y }, Int32Array.of(0, 25));
}

describe('charge sign from the turning sense (convention: B along +z, positive particles turn clockwise)', () => {
  // F = q v × B: v = x̂, B = ẑ → x̂ × ẑ = −ŷ, i.e. to the right of travel: clockwise for q > 0.
  it('clockwise arc in +B is positive, counter-clockwise is negative', () => {
    expect(momenta(trackOn(2, true), 1.5).charge[0]).toBe(1);
    expect(momenta(trackOn(2, false), 1.5).charge[0]).toBe(-1);
  });
  it('reversing the field reverses the assigned charge', () => {
    expect(momenta(trackOn(2, true), -1.5).charge[0]).toBe(-1);
  });
  it('reversing the hit order (travel direction) reverses the assigned charge', () => {
    const a = arc(0, 0, 2, Math.PI / 2, -0.7, 25);
    const rx = a.x.slice().reverse(), ry = a.y.slice().reverse();
    expect(momenta(fitCircles({ x: rx, y: ry }, Int32Array.of(0, 25)), 1.5).charge[0]).toBe(-1);
  });
  it('a circle-only fit gives p_T from the radius; direction of travel at the first hit', () => {
    const m = momentumAt(momenta(trackOn(2, true), 1.5), 0);
    expect(m.ptGeV).toBeCloseTo(0.899377374, 9);
    // Starting at the top of the circle going clockwise: travelling along +x.
    expect(m.pxGeV).toBeCloseTo(0.899377374, 9);
    expect(m.pyGeV).toBeCloseTo(0, 9);
    // Without z the dip is not measured: no p, p_z, tan λ or σ(p) rather than p = p_T.
    expect([m.pGeV, m.pzGeV, m.tanLambda, m.sigmaPGeV]).toEqual([NaN, NaN, NaN, NaN]);
  });
});

describe('momenta of helices', () => {
  it('p = p_T·√(1 + tan²λ), p_z = p_T·tan λ, and σ(p_T)/p_T = σ(κ)/|κ|', () => {
    const n = 30, R = 1.2, t = 0.5;
    const a = arc(0, 0, R, 0, -1.0, n);
    const z = new Float64Array(n);
    for (let i = 0; i < n; i++) z[i] = (t * R * 1.0 * i) / (n - 1);
    const s = new Float64Array(n).fill(1e-4);
    const fits = fitHelices({ x: a.x, y: a.y, z, sigmaX: s, sigmaY: s, sigmaZ: s }, Int32Array.of(0, n));
    const m = momentumAt(momenta(fits, 2), 0);
    const pt = 0.299792458 * 2 * R;
    expect(m.ptGeV).toBeCloseTo(pt, 9);
    expect(m.pGeV).toBeCloseTo(pt * Math.sqrt(1 + t * t), 9);
    expect(m.pzGeV).toBeCloseTo(pt * t, 9);
    expect(m.sigmaPtGeV / m.ptGeV).toBeCloseTo(Math.sqrt(fits.circle.cov[0]) / Math.abs(fits.circle.kappa[0]), 12);
    expect(m.sigmaPGeV).toBeGreaterThan(m.sigmaPtGeV * Math.sqrt(1 + t * t) * 0.99);
  });
  it('σ(p) is the spread of p: pulls (p − p_true)/σ(p) over 2000 smeared helices have mean 0 ± 0.07 and width 1 ± 0.05', () => {
    // Monte-Carlo truth, seed 15: R = 0.3 m turning 5 rad with tan λ = 1.5, 30 hits smeared by
    // 0.1 mm in x, y and z, B = 1 T. On this long, steep arc κ and tan λ are strongly correlated
    // (ρ ≈ −0.6, asserted below), so σ(p) without the correlation term, or with its sign flipped,
    // is off by a factor of about two and the pull width shows it. Statistical error of the width
    // for N = 2000: 1/√(2N) = 1.6 %; the band is three of those.
    const trials = 2000, n = 30, R = 0.3, span = 5, t = 1.5, e = 1e-4, fieldT = 1;
    const g = gaussian(15);
    const N = trials * n;
    const x = new Float64Array(N), y = new Float64Array(N), z = new Float64Array(N);
    const offsets = new Int32Array(trials + 1);
    for (let k = 0; k < trials; k++) {
      offsets[k] = k * n;
      for (let i = 0; i < n; i++) {
        const turned = (span * i) / (n - 1), j = k * n + i; // clockwise from the top of the circle
        x[j] = R * Math.sin(turned) + e * g();
        y[j] = R * Math.cos(turned) - R + e * g();
        z[j] = t * R * turned + e * g();
      }
    }
    offsets[trials] = N;
    const sigma = new Float64Array(N).fill(e);
    const fits = fitHelices({ x, y, z, sigmaX: sigma, sigmaY: sigma, sigmaZ: sigma }, offsets);
    const m = momenta(fits, fieldT);
    const pTrue = 0.299792458 * fieldT * R * Math.sqrt(1 + t * t); // common practice, exact c
    let s1 = 0, s2 = 0, rho = 0, used = 0;
    for (let k = 0; k < trials; k++) {
      if (!Number.isFinite(m.sigmaPGeV[k])) continue;
      const pull = (m.pGeV[k] - pTrue) / m.sigmaPGeV[k];
      s1 += pull; s2 += pull * pull; used++;
      rho += fits.cov[15 * k + 4] / Math.sqrt(fits.cov[15 * k] * fits.cov[15 * k + 14]);
    }
    expect(used).toBe(trials);
    const mean = s1 / used, width = Math.sqrt(s2 / used - mean * mean);
    expect(rho / used).toBeLessThan(-0.4);
    expect(Math.abs(mean)).toBeLessThan(0.07);
    expect(Math.abs(width - 1)).toBeLessThan(0.05);
  });
  it('a zero field and a charge number ≤ 0 are bad calls that say what is expected', () => {
    expect(() => momenta(trackOn(2, true), 0)).toThrow(/fieldT = 0.*non-zero magnetic field in tesla/);
    expect(() => momenta(trackOn(2, true), 1.5, { chargeMagnitude: 0 })).toThrow(/chargeMagnitude = 0.*positive charge number/);
    expect(() => momenta(trackOn(2, true), 1.5, { chargeMagnitude: -1 })).toThrow(/chargeMagnitude = -1.*positive charge number/);
  });
  it('|z| = 2 doubles p_T on the same radius and gives charge ±2; radius, direction and significance per track', () => {
    const a = arc(0, 0, 2, 0.3, -0.7, 25); // starts at angle 0.3 rad: travel direction φ0 = 0.3 − π/2
    const fits = fitCircles({ x: a.x, y: a.y }, Int32Array.of(0, 25));
    const one = momentumAt(momenta(fits, 1.5), 0);
    const two = momentumAt(momenta(fits, 1.5, { chargeMagnitude: 2 }), 0);
    expect(one.radiusM).toBeCloseTo(2, 9);
    expect(two.ptGeV).toBeCloseTo(2 * 0.899377374, 9);
    expect([one.charge, two.charge]).toEqual([1, 2]);
    const phi = 0.3 - Math.PI / 2;
    expect(one.pxGeV).toBeCloseTo(0.899377374 * Math.cos(phi), 9);
    expect(one.pyGeV).toBeCloseTo(0.899377374 * Math.sin(phi), 9);
    expect(one.curvatureSignificance).toBeCloseTo(Math.abs(fits.kappa[0]) / Math.sqrt(fits.cov[0]), 9);
  });
  it('a straight track (κ = 0 exactly) has charge 0, not −0, and infinite radius', () => {
    const fits = allocateCircleFits(1);
    fits.kappa[0] = 0; fits.cov[0] = 1e-6;
    const m = momentumAt(momenta(fits, 1.5), 0);
    expect(Object.is(m.charge, 0)).toBe(true);
    expect(m.radiusM).toBe(Infinity);
  });
});
