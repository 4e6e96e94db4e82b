import { kineticFromMomentum, momentumFromKinetic } from '../matter/kinematics.js';
import type { Medium } from '../matter/medium.js';
import type { Particle } from '../particles.js';
import { helixPoint, type HelixParameters } from './helixParameters.js';
import { transverseMomentumMeV } from './vertexTracks.js';

/** A track's state at a point: position [m], momentum [MeV/c] and its covariance [(MeV/c)²]. */
export interface TrackState {
  readonly point: Float64Array;
  /** (px, py, pz) [MeV/c]. */
  readonly pMeV: Float64Array;
  /** Row-major 3×3 covariance of (px, py, pz) [(MeV/c)²]. */
  readonly covMeV2: Float64Array;
  /** |p| at the point over |p| at the first hit (1 without a medium). */
  lossFactor: number;
  /** 'ok'; 'ranged-out' when the particle would have stopped before the point (downstream). */
  status: 'ok' | 'ranged-out';
}

export function newTrackState(): TrackState {
  return { point: new Float64Array(3), pMeV: new Float64Array(3), covMeV2: new Float64Array(9), lossFactor: 1, status: 'ok' };
}

/**
 * Momentum factor p(point)/p(first hit) for a particle of species `species` that travels a path
 * `pathM` [m] (3-D) between the point and the first hit through `medium`: upstream of the first
 * hit (pathM < 0) it had more energy, T = T(R(T₁) + |L|); downstream (pathM > 0) less,
 * T = T(R(T₁) − L) — the CSDA range tables of lib/matter (mean loss, no straggling).
 * NaN when the particle ranges out before the point.
 * @example energyLossFactor(300, -0.05, PION_PLUS, chamberMedium('liquid hydrogen')) // ≈ 1.005
 */
export function energyLossFactor(momentumMeV: number, pathM: number, species: Particle, medium: Medium): number {
  if (pathM === 0) return 1;
  const loss = medium.forSpecies(species);
  const t1 = kineticFromMomentum(species, momentumMeV);
  const r1 = loss.rangeM(t1);
  if (!Number.isFinite(r1)) return 1;
  const r = r1 - pathM;
  if (!(r > 0)) return NaN;
  return momentumFromKinetic(species, loss.kineticFromRangeM(r)) / momentumMeV;
}

/**
 * State of track `h` at transverse arc length `sM` from its first hit under the species
 * hypothesis `species`: position on the helix, direction of the helix there, momentum from the
 * fitted curvature at the first hit corrected for the mean energy lost between the first hit and
 * the point in `medium` (none when `medium` is omitted). The covariance is the fit's
 * (κ, φ0, tan λ) covariance carried to (px, py, pz) at the point, times the loss factor squared.
 *
 * This is the one place where a track's state at a point is computed: when the material-aware
 * track fit lands, its state at a point replaces the helix-plus-range-table model here.
 * Valid while the path between point and first hit is short compared with the particle's range
 * (the helix direction is not corrected for the change of curvature along that path).
 * @example trackStateAt(h, -0.04, { fieldT: 1.5, species: PION_MINUS, medium: chamberMedium('liquid-hydrogen') }).pMeV
 */
export interface TrackStateOptions {
  /** B_z [T], signed. */
  readonly fieldT: number;
  /** Species hypothesis (mass, |z|). */
  readonly species: Particle;
  /** Medium between the point and the hits; omitted → no energy-loss correction. */
  readonly medium?: Medium;
  /**
   * Arc length [m] at which the fitted curvature gives the momentum: 0 (the first hit) for a
   * fit that follows the slowing track; for a plain helix fitted to a slowing track, whose
   * curvature is a mean over the track, half the fitted length (the default of the finders).
   */
  readonly momentumArcM?: number;
}

export function trackStateAt(h: HelixParameters, sM: number, options: TrackStateOptions, out: TrackState = newTrackState()): TrackState {
  const { fieldT, species, medium } = options;
  const sRef = medium !== undefined ? options.momentumArcM ?? 0 : 0;
  helixPoint(h, sM, out.point);
  const pt = transverseMomentumMeV(h.kappa, fieldT, Math.abs(species.charge) || 1);
  const t = h.tanLambda;
  const sec = Math.sqrt(1 + t * t);
  let f = 1;
  out.status = 'ok';
  if (medium !== undefined) {
    f = energyLossFactor(pt * sec, (sM - sRef) * sec, species, medium);
    if (!Number.isFinite(f)) { out.status = 'ranged-out'; f = 0; }
  }
  out.lossFactor = f;
  const phi = h.phi0 + h.kappa * sM;
  const c = Math.cos(phi), s = Math.sin(phi);
  const p = f * pt;
  out.pMeV[0] = p * c;
  out.pMeV[1] = p * s;
  out.pMeV[2] = p * t;
  // ∂(px, py, pz)/∂(κ, φ0, tan λ) at fixed s (p_T ∝ 1/|κ|, φ = φ0 + κs).
  const ik = 1 / h.kappa;
  const j00 = -p * ik * c - p * s * sM, j01 = -p * s, j02 = 0;
  const j10 = -p * ik * s + p * c * sM, j11 = p * c, j12 = 0;
  const j20 = -p * ik * t, j21 = 0, j22 = p;
  const C = h.cov;
  const idx = [0, 1, 4];
  const J = [j00, j01, j02, j10, j11, j12, j20, j21, j22];
  for (let r = 0; r < 3; r++) for (let q = r; q < 3; q++) {
    let v = 0;
    for (let i = 0; i < 3; i++) for (let k = 0; k < 3; k++) v += J[3 * r + i] * C[5 * idx[i] + idx[k]] * J[3 * q + k];
    out.covMeV2[3 * r + q] = out.covMeV2[3 * q + r] = v;
  }
  return out;
}
