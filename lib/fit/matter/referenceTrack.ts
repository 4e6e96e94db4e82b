import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { HIGHLAND_MAX_X_OVER_X0, HIGHLAND_MIN_X_OVER_X0 } from '../../matter/highland.js';
import { kineticAndStoppingAtRange, rangeAtKinetic, type LossModel } from './lossModel.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';

/** Settings of one reference build (plain data). */
export interface ReferenceSettings {
  readonly fieldT: number;
  readonly energyLoss: boolean;
  readonly multipleScattering: boolean;
  /** Hit error [m] where the hits carry none. */
  readonly hitErrorM: number;
}

/** Largest turning angle of one propagation step [rad]; keeps the arc with mean curvature accurate. */
const MAX_TURN_RAD = 0.05;
/** Largest fraction of the residual range one step may use (steps shrink as the particle slows). */
const MAX_RANGE_FRACTION = 0.1;
/**
 * The point of closest approach is found to this distance along the track [m]: a shift s along
 * the track changes the residual across it by only κ·s²/2.
 */
const APPROACH_TOLERANCE_M = 1e-8;

/** `buildReference` result: all hits reached. */
export const REFERENCE_OK = -1;
/** `buildReference` result: a non-finite state (an index ≥ 0 is the first hit the hypothesis cannot reach). */
export const REFERENCE_DIVERGED = -2;

/**
 * The reference trajectory for the linearised fit: from the start state (x, y, φ, κ, z, tan λ) at
 * the first hit, the helix in a uniform B_z with the mean (CSDA) energy loss of the hypothesis,
 * followed to the point closest to each hit in the bending plane. Steps are arcs with the mean
 * of the curvatures at their ends (trapezoid rule for the turning angle); they shrink to
 * ≤ 0.05 rad of turning and ≤ 10 % of the residual range, so the low-momentum end of a stopping
 * track is followed finely. Along the way it builds, per hit step, the 3×3 Jacobian of the
 * bending-plane deviations (u across the track, ψ of direction, δκ) — the small-deviation
 * solution u'' = δκ − κ²u on an arc, with δκ carried by ∂κ(s)/∂κ(0) = (p₀/p)²·β₀S/(βS₀) from the
 * range–energy relation R(p) = R(p₀) − s — and the process noise: Highland θ₀ per step for a
 * thick scatterer (var u = θ₀²l²/3, cov(u,ψ) = θ₀²l/(2cos λ), var ψ = θ₀²/cos²λ; the (z, tan λ)
 * pair alike with the factors 1/cos λ and 1/cos²λ; PDG RPP "Passage of particles through
 * matter", multiple scattering), plus Bohr straggling on κ. The bending plane and (z, tan λ)
 * are linearised separately (their coupling through cos λ in κ and the path length is second
 * order and left out). Returns REFERENCE_OK, REFERENCE_DIVERGED, or the index of the first hit
 * the hypothesis cannot reach (its range ends before).
 */
export function buildReference(model: LossModel, hits: MatterTrackHits, start: Float64Array, set: ReferenceSettings, sc: MatterFitScratch): number {
  const n = hits.x.length;
  const hx = hits.x, hy = hits.y, hz = hits.z, sgx = hits.sigmaX, sgy = hits.sigmaY, sgz = hits.sigmaZ;
  const tanL = start[5];
  const secL = Math.sqrt(1 + tanL * tanL), cosL = 1 / secL;
  const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(set.fieldT) * secL; // |κ| = cK / p
  // Settings and model numbers the arcs read, loaded once.
  const energyLoss = set.energyLoss, multipleScattering = set.multipleScattering, gcm2PerM = model.gcm2PerM;
  const rr = model.table.csdaRangeGcm2, tt = model.table.kineticEnergyMeV, ss = model.table.stoppingPowerMeVcm2g, iw = model.invCellWidth;
  const straggling = energyLoss && model.stragglingMeV2PerM > 0, radiative = energyLoss && model.radiativeVariancePerX0 > 0;
  const cur = sc.cur, tmp = sc.tmp, F = sc.F, Q = sc.Q, Qz = sc.Qz;
  const kap0 = start[3];
  const sgn = kap0 < 0 ? -1 : 1;
  cur[0] = start[0]; cur[1] = start[1]; cur[2] = start[2]; cur[3] = kap0;
  cur[7] = cK / Math.abs(kap0);
  cur[4] = Infinity; cur[5] = Infinity; cur[6] = 0;
  if (set.energyLoss && Number.isFinite(cur[7])) {
    const m = model.massMeV, pm = 1000 * cur[7];
    const t = Math.sqrt(pm * pm + m * m) - m;
    const r = rangeAtKinetic(model, t);
    if (Number.isFinite(r)) {
      kineticAndStoppingAtRange(model, r, sc.tmp);
      cur[4] = r; cur[5] = sc.tmp[0]; cur[6] = sc.tmp[1];
      cur[16] = (cur[5] + m) / pm; // 1/β, carried from arc to arc with T and S
    }
  }
  cur[8] = start[4]; cur[9] = 0; cur[10] = Math.cos(start[2]); cur[11] = Math.sin(start[2]);
  cur[12] = 0; cur[13] = -1; // ln of the clamped x/X₀ at path cur[13] (none yet)
  cur[14] = 0; cur[15] = -1; // ln β² of the last step, at β² = cur[15] (none yet)
  for (let i = 0; i < n; i++) {
    let dsTotal = 0;
    if (i > 0) {
      // This hit step's Jacobian and noise accumulate in place over its arcs; its first arc writes
      // them whole (`fresh`), and a step without an arc gets F = 1, Q = 0 after the loop.
      const o = 9 * i, oz = 3 * i;
      let fresh = true;
      for (let it = 0; it < 8; it++) {
        // Arc to the point of the current circle closest to the hit: angle atan2(κ·a, 1 − κ·b) with
        // (a, b) the hit along and across the direction (exact for constant κ; then corrected).
        const c = cur[10], s = cur[11];
        const ex = hx[i] - cur[0], ey = hy[i] - cur[1];
        const along = ex * c + ey * s;
        if (it > 0 && Math.abs(along) < APPROACH_TOLERANCE_M) break;
        const kap = cur[3], across = -ex * s + ey * c;
        const d = arcToClosest(kap, along, across);
        if (energyLoss && d > 0 && d * secL * gcm2PerM >= cur[4]) return i;
        let remaining = d;
        while (remaining !== 0) {
          const kap = Math.abs(cur[3]);
          let ds = remaining;
          if (Math.abs(ds) * kap > MAX_TURN_RAD) ds = Math.sign(ds) * (MAX_TURN_RAD / kap);
          if (energyLoss && ds > 0 && Number.isFinite(cur[4]) && ds * gcm2PerM > MAX_RANGE_FRACTION * cur[4] * cosL) {
            const rangeLimit = (MAX_RANGE_FRACTION * cur[4] * cosL) / gcm2PerM;
            if (ds > rangeLimit && remaining > rangeLimit * 1.0001) ds = rangeLimit;
          }
          {
            // One arc of transverse length ds [m] (negative: backwards) from the current state
            // (cur: x, y, φ, κ, residual range, T, S, p, z, path, cos φ, sin φ, ln x̃/X₀ at path
            // cur[13], ln β² at β² = cur[15], 1/β); the hit step's Jacobian and noise accumulate at
            // F/Q[o..o+8], Qz[oz..oz+2] (`fresh`: its first arc, the accumulators still 1
            // and 0). Written out here rather than called, so that the engine keeps it in one frame.
            const l = ds * secL;
            const kapS = cur[3], pS = cur[7];
            let kapE = kapS, pE = pS, g = 1, invPBeta = 0;
            const m = model.massMeV;
            if (energyLoss && Number.isFinite(cur[4])) {
              const rE = cur[4] - l * gcm2PerM;
              // The cell of the last table lookup (hint tmp[2]) mostly still holds rE: the cubic
              // Hermite of `kineticAndStoppingAtRange` there, else the full lookup.
              const lo = tmp[2] | 0;
              let tE: number, sE: number;
              if (lo >= 0 && lo < rr.length - 2 && rr[lo] <= rE && rE < rr[lo + 1]) {
                const h = rr[lo + 1] - rr[lo], ih = iw[lo], u = (rE - rr[lo]) * ih, u2 = u * u, u3 = u2 * u;
                const y0 = tt[lo], y1 = tt[lo + 1], d0 = ss[lo], d1 = ss[lo + 1];
                tE = (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * h * d0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * h * d1;
                sE = ((6 * u2 - 6 * u) * y0 + (-6 * u2 + 6 * u) * y1) * ih + (3 * u2 - 4 * u + 1) * d0 + (3 * u2 - 2 * u) * d1;
              } else {
                kineticAndStoppingAtRange(model, rE, tmp);
                tE = tmp[0]; sE = tmp[1];
              }
              const pEm = Math.sqrt(tE * (tE + 2 * m)), invPm = 1 / pEm;
              pE = pEm * 0.001;
              kapE = sgn * cK * 1000 * invPm;
              // 1/β at the start (carried) and at the end of the arc: divisions saved.
              const invBetaS = cur[16], invBetaE = (tE + m) * invPm;
              invPBeta = invBetaE * invPm;
              const ratio = 1000 * pS * invPm;
              // g = (pS/pE)²·βS·S_E/(βE·S_S).
              g = cur[6] > 0 ? (ratio * ratio * sE * invBetaE) / (invBetaS * cur[6]) : 1;
              cur[4] = rE; cur[5] = tE; cur[6] = sE; cur[7] = pE; cur[3] = kapE; cur[16] = invBetaE;
            }
            const kapM = 0.5 * (kapS + kapE);
            const a = kapM * ds;
            const phi = cur[2];
            const cphi = cur[10], sphi = cur[11];
            let ca: number, sa: number, sOverK: number, oneMinusCOverK2: number;
            if (Math.abs(a) < 0.1) {
              // Taylor series to a⁸ (the next terms are below 3e-17 at |a| = 0.1), multiplied by the
              // reciprocals of the factorial ratios (folded constants: no division per arc).
              const a2 = a * a;
              const sinc = 1 - a2 * (1 / 6) * (1 - a2 * (1 / 20) * (1 - a2 * (1 / 42) * (1 - a2 * (1 / 72))));
              const cosc = 1 - a2 * (1 / 12) * (1 - a2 * (1 / 30) * (1 - a2 * (1 / 56) * (1 - a2 * (1 / 90))));
              ca = 1 - 0.5 * a2 * (1 - a2 * (1 / 12) * (1 - a2 * (1 / 30) * (1 - a2 * (1 / 56))));
              sa = a * sinc;
              sOverK = ds * sinc;
              oneMinusCOverK2 = 0.5 * ds * ds * cosc;
            } else {
              ca = Math.cos(a); sa = Math.sin(a);
              sOverK = sa / kapM;
              oneMinusCOverK2 = (1 - ca) / (kapM * kapM);
            }
            // Position along the arc: Δx = (sin(φ+a) − sin φ)/κ, Δy = (cos φ − cos(φ+a))/κ, in the stable form.
            cur[0] += sOverK * cphi - kapM * oneMinusCOverK2 * sphi;
            cur[1] += sOverK * sphi + kapM * oneMinusCOverK2 * cphi;
            cur[2] = phi + a;
            cur[10] = cphi * ca - sphi * sa; cur[11] = sphi * ca + cphi * sa;
            cur[8] += ds * tanL;
            const before = cur[9];
            cur[9] += Math.abs(l);
            // Jacobian of this arc: [[c, s/κ, (1−c)/κ²·ḡ], [−κ s, c, s/κ·ḡ], [0, 0, g]], ḡ = (1+g)/2.
            const gm = 0.5 * (1 + g);
            const f00 = ca, f01 = sOverK, f02 = oneMinusCOverK2 * gm;
            const f10 = -kapM * sa, f11 = ca, f12 = sOverK * gm;
            let n00 = 0, n01 = 0, n11 = 0, n02 = 0, n12 = 0, n22 = 0, z00 = 0, z01 = 0, z11 = 0;
            if (fresh) {
              F[o] = f00; F[o + 1] = f01; F[o + 2] = f02; F[o + 3] = f10; F[o + 4] = f11; F[o + 5] = f12; F[o + 6] = 0; F[o + 7] = 0; F[o + 8] = g;
            } else {
              // F ← Fs·F (F's last row is [0, 0, G]).
              for (let c = o; c < o + 3; c++) {
                const a0 = F[c], a1 = F[3 + c], a2 = F[6 + c];
                F[c] = f00 * a0 + f01 * a1 + f02 * a2;
                F[3 + c] = f10 * a0 + f11 * a1 + f12 * a2;
                F[6 + c] = g * a2;
              }
              // Q ← Fs·Q·Fsᵀ + Qs.
              const q00 = Q[o], q01 = Q[o + 1], q02 = Q[o + 2], q11 = Q[o + 4], q12 = Q[o + 5], q22 = Q[o + 8];
              const r00 = f00 * q00 + f01 * q01 + f02 * q02, r01 = f00 * q01 + f01 * q11 + f02 * q12, r02 = f00 * q02 + f01 * q12 + f02 * q22;
              const r10 = f10 * q00 + f11 * q01 + f12 * q02, r11 = f10 * q01 + f11 * q11 + f12 * q12, r12 = f10 * q02 + f11 * q12 + f12 * q22;
              n00 = r00 * f00 + r01 * f01 + r02 * f02;
              n01 = r00 * f10 + r01 * f11 + r02 * f12;
              n11 = r10 * f10 + r11 * f11 + r12 * f12;
              n02 = r02 * g; n12 = r12 * g;
              n22 = g * g * q22;
              // (z, t) propagation [[1, ds], [0, 1]].
              z00 = Qz[oz] + 2 * ds * Qz[oz + 1] + ds * ds * Qz[oz + 2];
              z01 = Qz[oz + 1] + ds * Qz[oz + 2];
              z11 = Qz[oz + 2];
            }
            const al = Math.abs(l);
            if (multipleScattering && al > 0) {
              // Highland θ₀² increment over this step after the path before it, in the stepwise form
              // of the chamber medium (`chamberMedium(...).forSpecies(...).theta0Rad`; PDG RPP "Passage
              // of particles through matter"): θ₀²(t) = (0.0136 z/(βp))²·t·[1 + 0.038 (ln t̃ + ln z² − ln β²)]²,
              // t = x/X₀, t̃ = t clamped to 1e-3…100 (θ₀² continued linearly in t outside), the step's
              // increment (0.0136 z/(βp))²·(term(t_after) − term(t_before)). The same formula as
              // `highlandTheta0`, arranged so that a step needs one new logarithm (the log of the path
              // before it is the one after the previous step). Validity: Highland's (11 %, 1e-3 < x/X₀ < 100).
              // (0.0136 z/(βp))² = (0.0136 z)²·E²/p⁴ with E² = p² + m² [GeV²].
              const pM = 0.5 * (pS + pE);
              const pM2 = pM * pM, e2 = pM2 + model.massGeVSq, beta2 = pM2 / e2;
              // ln β² from the last step's (cur[14] at β² = cur[15]) plus the log of their ratio
              // r = 1 + x by its series where |x| < 1e-3 (to x⁵: error below 2e-16), else Math.log: a
              // track's β changes little from one step to the next, so this saves a logarithm per step.
              const xb = cur[15] > 0 ? beta2 / cur[15] - 1 : Infinity;
              const lnBeta2 = Math.abs(xb) < 1e-3 ? cur[14] + xb * (1 - xb * (1 / 2 - xb * (1 / 3 - xb * (1 / 4 - xb * (1 / 5))))) : Math.log(beta2);
              cur[14] = lnBeta2; cur[15] = beta2;
              const lnZB = model.lnChargeSq - lnBeta2;
              const perX0 = model.radiationLengthsPerM;
              const tB = before * perX0, tA = cur[9] * perX0;
              // term(t) = t·[1 + 0.038 (ln t̃ + lnZB)]² after and before the step, written out here
              // (the engine does not inline calls into this large function).
              const lnA = Math.log(Math.min(Math.max(tA, HIGHLAND_MIN_X_OVER_X0), HIGHLAND_MAX_X_OVER_X0));
              let termB = 0;
              if (before > 0) {
                const fB = 1 + 0.038 * ((cur[13] === before ? cur[12] : Math.log(Math.min(Math.max(tB, HIGHLAND_MIN_X_OVER_X0), HIGHLAND_MAX_X_OVER_X0))) + lnZB);
                termB = tB * fB * fB;
              }
              const fA = 1 + 0.038 * (lnA + lnZB);
              const t2 = Math.max(0, ((model.highlandScaleSq * e2) / (pM2 * pM2)) * (tA * fA * fA - termB));
              cur[12] = lnA; cur[13] = cur[9];
              const t2l = t2 * al, sec2 = secL * secL;
              n00 += t2l * al * (1 / 3); n01 += 0.5 * t2l * secL; n11 += t2 * sec2;
              z00 += t2l * al * sec2 * (1 / 3); z01 += 0.5 * t2l * sec2 * secL; z11 += t2 * sec2 * sec2;
            }
            if (straggling && Number.isFinite(cur[4])) {
              const dk = kapE * invPBeta; // κ/(pβ), p [MeV/c]
              n22 += dk * dk * model.stragglingMeV2PerM * al;
            }
            // e±: bremsstrahlung straggling, var(δκ/κ) = var(δp/p) = 0.415 per radiation length.
            if (radiative) n22 += kapE * kapE * model.radiativeVariancePerX0 * al * model.radiationLengthsPerM;
            Q[o] = n00; Q[o + 1] = n01; Q[o + 2] = n02; Q[o + 3] = n01; Q[o + 4] = n11; Q[o + 5] = n12; Q[o + 6] = n02; Q[o + 7] = n12; Q[o + 8] = n22;
            Qz[oz] = z00; Qz[oz + 1] = z01; Qz[oz + 2] = z11;
            if (!Number.isFinite(cur[0] + cur[1] + cur[2] + cur[3])) return REFERENCE_DIVERGED;
          }
          fresh = false;
          dsTotal += ds;
          remaining = Math.abs(remaining - ds) < 1e-15 ? 0 : remaining - ds;
        }
      }
      if (fresh) {
        F[o] = 1; F[o + 1] = 0; F[o + 2] = 0; F[o + 3] = 0; F[o + 4] = 1; F[o + 5] = 0; F[o + 6] = 0; F[o + 7] = 0; F[o + 8] = 1;
        for (let k = 0; k < 9; k++) Q[o + k] = 0;
        Qz[oz] = 0; Qz[oz + 1] = 0; Qz[oz + 2] = 0;
      }
      if (!Number.isFinite(cur[0] + cur[1] + cur[2] + cur[3])) return REFERENCE_DIVERGED;
    }
    // The reference at hit i, and the hit's residual across it and its variance (and in z);
    // the direction cosines, carried by rotation along the arcs, renormalised once per hit.
    const norm = 1 / Math.sqrt(cur[10] * cur[10] + cur[11] * cur[11]);
    cur[10] *= norm; cur[11] *= norm;
    const c = cur[10], s = cur[11];
    sc.ds[i] = dsTotal;
    sc.x[i] = cur[0]; sc.y[i] = cur[1]; sc.phi[i] = cur[2]; sc.kappa[i] = cur[3];
    sc.range[i] = cur[4]; sc.p[i] = cur[7]; sc.z[i] = cur[8]; sc.path[i] = cur[9];
    sc.mr[i] = -s * (hx[i] - cur[0]) + c * (hy[i] - cur[1]);
    const sx = sgx ? sgx[i] : set.hitErrorM;
    const sy = sgy ? sgy[i] : sx;
    sc.mv[i] = s * s * sx * sx + c * c * sy * sy;
    if (hz) {
      const sz = sgz ? sgz[i] : sx;
      sc.zr[i] = hz[i] - cur[8];
      sc.zv[i] = sz * sz;
    }
  }
  return REFERENCE_OK;
}

/**
 * Transverse arc length [m] along a circle of curvature κ to the point closest to a hit at
 * (along, across) of the current point and direction: atan2(κ·a, 1 − κ·b)/κ, by its Taylor
 * series where the turning angle is small (|q| < 0.05: error below 1e-15 relative).
 */
function arcToClosest(kap: number, along: number, across: number): number {
  const den = 1 - kap * across;
  if (den > 0) {
    const a = along / den, q = kap * a;
    if (Math.abs(q) < 0.05) {
      const q2 = q * q;
      return a * (1 - q2 * (1 / 3 - q2 * (1 / 5 - q2 * (1 / 7 - q2 * (1 / 9)))));
    }
  }
  return Math.abs(kap * along) < 1e-9 ? along : Math.atan2(kap * along, den) / kap;
}
