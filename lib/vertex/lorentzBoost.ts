import type { FourVector } from './fourVector.js';

/**
 * Lorentz boost of the four-momentum `v` [MeV] into a frame moving with velocity β (in units of
 * c, |β| < 1) relative to the present one (passive boost; PDG RPP "Kinematics"):
 *   E' = γ(E − β·p),  p' = p + [(γ − 1)(β·p)/β² − γE] β.
 * β = 0 returns the vector unchanged; |β| ≥ 1 gives NaN components.
 * @example boostFourVector(parent, parent[1] / parent[0], parent[2] / parent[0], parent[3] / parent[0]) // → (m, 0, 0, 0)
 */
export function boostFourVector(v: ArrayLike<number>, betaX: number, betaY: number, betaZ: number): FourVector {
  const b2 = betaX * betaX + betaY * betaY + betaZ * betaZ;
  if (b2 === 0) return [v[0], v[1], v[2], v[3]];
  if (!(b2 < 1)) return [NaN, NaN, NaN, NaN];
  const gamma = 1 / Math.sqrt(1 - b2);
  const bp = betaX * v[1] + betaY * v[2] + betaZ * v[3];
  // (γ − 1)/β² written as γ²/(γ + 1), which keeps precision for small β.
  const k = ((gamma * gamma) / (gamma + 1)) * bp - gamma * v[0];
  return [gamma * (v[0] - bp), v[1] + k * betaX, v[2] + k * betaY, v[3] + k * betaZ];
}

/**
 * `v` seen in the rest frame of the system whose four-momentum is `frame` (boost by β = p/E of
 * the frame). The frame must be time-like (E > |p|).
 * @example toRestFrame(daughter, parent) // daughter momentum in the parent's rest frame
 */
export function toRestFrame(v: ArrayLike<number>, frame: ArrayLike<number>): FourVector {
  return boostFourVector(v, frame[1] / frame[0], frame[2] / frame[0], frame[3] / frame[0]);
}
