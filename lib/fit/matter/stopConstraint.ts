import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { varianceAtKinetic } from '../../matter/rangeStraggling.js';
import { kineticAndStoppingAtRange, type LossModel } from './lossModel.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';

/**
 * Where the stop constraint is applied: the last hit at least this many mean spacings (of path
 * along the hits) before the last one (the first hit on a shorter track). There the residual
 * range, known to ±½ spacing, gives a nearly Gaussian curvature (≈ 3 % in R, ≈ 1 % in κ), and
 * the filters carry it back through hits that scatter little. Measured on stopping tracks in
 * liquid propane (2 T, 5 mm spacing, 200 µm, straggling simulated; 3 000 tracks each), pull rms
 * of p at the first hit with the constraint 1, 2, 4, 8, 16 spacings before the end, μ⁻:
 * 1.18, 1.15, 1.12, 1.07, 1.05 (35–50-hit tracks 1.62 … 1.19); π⁺ 1.02 at 4 and 1.00 at 16;
 * protons and K⁺ 0.96–1.01 at either.
 */
export const STOP_CONSTRAINT_SPACINGS = 16;

/**
 * The range–energy constraint of a track known to stop (it ends inside the chamber and nothing
 * leaves its end point), for the current reference in the scratch: the particle comes to rest
 * between its last hit and one mean 3-D hit spacing Δ beyond it, so at hit c (the last hit at
 * least STOP_CONSTRAINT_SPACINGS spacings of path before the end; the first hit on a shorter
 * track) its residual range is R_c = ρ(L_c + x) − δ, with L_c the path from hit c to the last
 * hit along the hits (`hitPathM`; the reference's own path, which does not follow the
 * scattering, was off by ±1.5 spacings rms on 50-hit stopping muons in propane), x uniform on
 * [0, Δ] and δ the range straggling from c to rest (Gaussian, `rangeStragglingVariances`).
 * That is a measurement R_c = ρ(L_c + Δ/2) with variance (ρΔ)²/12 + σ_R², carried to the
 * curvature at hit c through κ = c_B·sec λ/p(R) (dκ/dR = −(κ/p)·S/β, S the stopping power), and
 * written as a measurement of the filters' δκ there: sc.stop = [c, κ(R_c) − κ_ref(c), variance].
 * Applied there rather than at the first hit, the straggling before hit c stays the filters'
 * process noise: applied at the first hit with the whole track's straggling as its error, the
 * constraint counted the loss fluctuations the hits also see twice. Momentum from range for a stopping
 * track is common practice; with it the momentum error of a stopping proton is a fraction of
 * what the curvature of its hits alone measures.
 * `tanLambda` is the reference's dip. Returns false (sc.stop untouched) when no constraint can be
 * made: an e± hypothesis (no Gaussian range) or a non-finite result.
 */
export function stopConstraint(model: LossModel, sc: MatterFitScratch, hits: MatterTrackHits, hitErrorM: number, fieldT: number, tanLambda: number): boolean {
  if (model.rangeStragglingVariance.length === 0) return false;
  const n = hits.x.length;
  const c = constraintHit(hits, hitErrorM, tanLambda, sc.tmp);
  const pathAfter = sc.tmp[3], spacingGcm2 = sc.tmp[4] * model.gcm2PerM;
  const rc = pathAfter * model.gcm2PerM + 0.5 * spacingGcm2;
  const tmp = sc.tmp, m = model.massMeV;
  kineticAndStoppingAtRange(model, rc, tmp);
  const t = tmp[0], s = tmp[1];
  const pm = Math.sqrt(t * (t + 2 * m)), beta = pm / (t + m);
  const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(fieldT) * Math.sqrt(1 + tanLambda * tanLambda);
  const kappa = (Math.sign(sc.kappa[c]) * cK * 1000) / pm;
  const varR = (spacingGcm2 * spacingGcm2) / 12 + varianceAtKinetic(model.table, model.rangeStragglingVariance, t);
  const dkdr = (kappa / pm) * (s / beta);
  const v = dkdr * dkdr * varR;
  const dk = kappa - sc.kappa[c];
  if (!(Number.isFinite(dk) && v > 0 && Number.isFinite(v)) || n < 2) return false;
  sc.stop[0] = c;
  sc.stop[1] = dk;
  sc.stop[2] = v;
  return true;
}

/**
 * The hit of the stop constraint (see `stopConstraint`), with the path [m] from it to the last
 * hit in out[3] and the mean spacing [m] of the whole track in out[4], both along the hits.
 */
function constraintHit(hits: MatterTrackHits, hitErrorM: number, tanLambda: number, out: Float64Array): number {
  const n = hits.x.length;
  const total = hitPathM(hits, hitErrorM, tanLambda, 0, n - 1);
  const spacing = total / (n - 1);
  let c = n - 1, after = 0;
  while (c > 0 && after < STOP_CONSTRAINT_SPACINGS * spacing) {
    after += hitPathM(hits, hitErrorM, tanLambda, c - 1, c);
    c--;
  }
  out[3] = after;
  out[4] = spacing;
  return c;
}

/**
 * Path [m] from hit `from` to hit `to` (default: the first and the last) along the hits: the sum of 3-D chords (without z: of
 * bending-plane chords, times sec λ), less the mean excess the hit errors add to each chord,
 * (V⊥ᵢ + V⊥ᵢ₊₁)/(2ℓ) with V⊥ the hit variance across the chord (a chord of length ℓ between
 * points with independent errors is longer on average by half its transverse variance over ℓ;
 * geometry). A chord is shorter than its arc by (ℓ/R)²/24 of itself, left uncorrected (0.3 % for
 * 5 mm on a 2 cm radius). Hit errors: the sigma columns, else `hitErrorM`.
 */
export function hitPathM(hits: MatterTrackHits, hitErrorM: number, tanLambda: number, from = 0, to = hits.x.length - 1): number {
  const { x, y, z } = hits;
  let path = 0;
  for (let i = from + 1; i <= to; i++) {
    const dx = x[i] - x[i - 1], dy = y[i] - y[i - 1], dz = z ? z[i] - z[i - 1] : 0;
    const l2 = dx * dx + dy * dy + dz * dz;
    if (!(l2 > 0)) continue;
    const l = Math.sqrt(l2), ux2 = (dx * dx) / l2, uy2 = (dy * dy) / l2, uz2 = (dz * dz) / l2;
    const v = acrossVariance(hits, hitErrorM, i - 1, ux2, uy2, uz2) + acrossVariance(hits, hitErrorM, i, ux2, uy2, uz2);
    path += Math.max(0, l - v / (2 * l));
  }
  return z ? path : path * Math.sqrt(1 + tanLambda * tanLambda);
}

/** Variance [m²] of hit j across a chord of squared direction cosines (ux², uy², uz²). */
function acrossVariance(hits: MatterTrackHits, hitErrorM: number, j: number, ux2: number, uy2: number, uz2: number): number {
  const sx = hits.sigmaX ? hits.sigmaX[j] : hitErrorM, sy = hits.sigmaY ? hits.sigmaY[j] : sx;
  let v = sx * sx * (1 - ux2) + sy * sy * (1 - uy2);
  if (hits.z) {
    const sz = hits.sigmaZ ? hits.sigmaZ[j] : sx;
    v += sz * sz * (1 - uz2);
  }
  return v;
}
