import type { Shape } from './shape.js';

/**
 * Michel spectrum of the electron (positron) from muon decay at rest, with parameters
 * [area, endpoint]: area · (2/E₀) · u²(3 − 2u) for u = E/E₀ in [0, 1], zero outside, with
 * E₀ = `endpoint` the largest energy (≈ 52.83 MeV, (m_μ² + m_e²)/2m_μ). This is the V−A spectrum
 * integrated over angles (Michel parameter ρ = 3/4; L. Michel, Proc. Phys. Soc. A 63 (1950) 514;
 * PDG RPP, "Muon Decay Parameters"), with the electron mass and radiative corrections
 * neglected — both shift the shape by a few per cent near u → 0 and u → 1. Energy and momentum
 * coincide at this order, so x may be either, in MeV. The bin integral is exact.
 * @example michelSpectrum().value(52.83, [1, 52.83]) // 2/52.83 ≈ 0.03786 (the maximum, at the endpoint)
 */
export function michelSpectrum(): Shape {
  return MICHEL;
}

const cumulative = (u: number) => { const c = Math.min(1, Math.max(0, u)); return c * c * c * (1 - 0.5 * c); }; // ∫₀ᵘ 2v²(3 − 2v) dv / 2

const MICHEL: Shape = Object.freeze({
  name: 'Michel spectrum',
  parameters: Object.freeze(['area', 'endpoint']),
  value(x: number, p: ArrayLike<number>, at = 0): number {
    const e0 = p[at + 1];
    if (!(e0 > 0)) return NaN;
    const u = x / e0;
    return u < 0 || u > 1 ? 0 : ((2 * p[at]) / e0) * u * u * (3 - 2 * u);
  },
  integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
    const e0 = p[at + 1];
    if (!(e0 > 0)) return NaN;
    return 2 * p[at] * (cumulative(b / e0) - cumulative(a / e0));
  },
});
