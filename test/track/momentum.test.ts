import { describe, expect, it } from 'vitest';
import { fitCircles } from '../../lib/fit/fitCircles.js';
import { fitHelices } from '../../lib/fit/fitHelices.js';
import { momenta, momentumAt, transverseMomentumGeV, radiusOfCurvatureM } from '../../lib/track/momentum.js';
import { GEV_PER_TESLA_METRE, SPEED_OF_LIGHT_M_S } from '../../lib/constants.js';
import { arc } from '../fit/helpers.js';

describe('transverseMomentumGeV: p_T = 0.299792458·|z|·B·R (common practice; c exact, CODATA 2018)', () => {
  it('the constant is c/1e9 with c = 299 792 458 m/s exactly', () => {
    expect(SPEED_OF_LIGHT_M_S).toBe(299_792_458);
    expect(GEV_PER_TESLA_METRE).toBeCloseTo(0.299792458, 15);
  });
  it('R = 2 m in 1.5 T → 0.899377374 GeV/c; an alpha (|z| = 2) on the same radius has twice that', () => {
    expect(transverseMomentumGeV(1.5, 2)).toBeCloseTo(0.899377374, 12);
    expect(transverseMomentumGeV(1.5, 2, 2)).toBeCloseTo(1.798754748, 12);
    expect(radiusOfCurvatureM(0.899377374, 1.5)).toBeCloseTo(2, 9);
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
  it('a zero field is a bad call', () => {
    expect(() => momenta(trackOn(2, true), 0)).toThrow(/fieldT = 0/);
  });
});
