import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { rangeAtKinetic, kineticAndStoppingAtRange, type LossModel } from './lossModel.js';
import type { MatterTrackHits } from './matterTrackFit.js';

/**
 * Start state (x, y, φ, κ, z, tan λ) of the fit at the first hit, written to `out`: the circle
 * through the first, middle and last hits of a leading stretch of the track — the whole track,
 * or for a looper the first half, quarter, … until the stretch turns by at most π/2 (its
 * curvature is a mean over the stretch) — and the dip from the z change over the stretch's
 * path. With energy loss the curvature is moved to the first hit: the momentum there is the one
 * whose CSDA range exceeds that of the stretch's mean momentum by half the stretch's path, and
 * at least 1.05 times the whole path, so that the start reaches every hit. A rough
 * start is enough: the fit iterates from it. False when the hits are degenerate. `tmp`: 3 numbers
 * of scratch (the table hint in tmp[2]).
 */
export function seedState(hits: MatterTrackHits, model: LossModel, fieldT: number, energyLoss: boolean, out: Float64Array, tmp: Float64Array): boolean {
  const n = hits.x.length, x = hits.x, y = hits.y;
  let path = 0;
  for (let i = 1; i < n; i++) path += chord(x, y, i);
  // A looper (a spiral of more than about a quarter turn) has no one circle: take the three hits
  // from a leading stretch short enough to turn by at most π/2, halving it until it does.
  let end = n - 1, m = n >> 1, kappa = NaN, span = path;
  for (;;) {
    kappa = circleCurvature(x, y, 0, m, end);
    if (end === n - 1) span = path;
    else {
      span = 0;
      for (let i = 1; i <= end; i++) span += chord(x, y, i);
    }
    if (!(Math.abs(kappa) * span > 0.5 * Math.PI) || m < 2) break;
    end = m;
    m = end >> 1;
  }
  if (!Number.isFinite(kappa)) return false;
  const ax = x[m] - x[0], ay = y[m] - y[0];
  const la = Math.sqrt(ax * ax + ay * ay);
  // Chord direction to the middle hit is φ + κ·arc/2.
  const halfTurn = 0.5 * kappa * arcOfChord(la, kappa);
  const phi = Math.atan2(ay, ax) - halfTurn;
  const tanL = hits.z ? (hits.z[end] - hits.z[0]) / span : 0;
  out[0] = x[0]; out[1] = y[0]; out[2] = phi; out[3] = kappa; out[4] = hits.z ? hits.z[0] : 0; out[5] = Number.isFinite(tanL) ? tanL : 0;
  if (energyLoss && kappa !== 0) {
    const secL = Math.sqrt(1 + out[5] * out[5]);
    const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(fieldT) * secL;
    const pMeV = (1000 * cK) / Math.abs(kappa), mass = model.massMeV;
    const rMean = rangeAtKinetic(model, Math.sqrt(pMeV * pMeV + mass * mass) - mass);
    const spanGcm2 = span * secL * model.gcm2PerM, pathGcm2 = path * secL * model.gcm2PerM;
    if (Number.isFinite(rMean)) {
      const r0 = Math.max(rMean + 0.5 * spanGcm2, 1.05 * pathGcm2);
      kineticAndStoppingAtRange(model, r0, tmp);
      const p0 = Math.sqrt(tmp[0] * (tmp[0] + 2 * mass)) / 1000;
      out[3] = (Math.sign(kappa) * cK) / p0;
    }
  }
  return Number.isFinite(out[2] + out[3]);
}

/** Signed curvature [1/m] of the circle through hits a, b, c (NaN when two coincide). */
function circleCurvature(x: Float64Array, y: Float64Array, a: number, b: number, c: number): number {
  const ax = x[b] - x[a], ay = y[b] - y[a], bx = x[c] - x[a], by = y[c] - y[a];
  const cx = x[c] - x[b], cy = y[c] - y[b];
  const la = Math.sqrt(ax * ax + ay * ay), lb = Math.sqrt(bx * bx + by * by), lc = Math.sqrt(cx * cx + cy * cy);
  if (!(la > 0 && lb > 0 && lc > 0)) return NaN;
  return (2 * (ax * by - ay * bx)) / (la * lb * lc);
}

/** Distance [m] in the bending plane from hit i − 1 to hit i. */
function chord(x: ArrayLike<number>, y: ArrayLike<number>, i: number): number {
  const dx = x[i] - x[i - 1], dy = y[i] - y[i - 1];
  return Math.sqrt(dx * dx + dy * dy);
}

/** Arc length of a chord c on a circle of curvature κ. */
function arcOfChord(c: number, kappa: number): number {
  const h = 0.5 * c * Math.abs(kappa);
  return h < 1e-6 ? c : h >= 1 ? Math.PI / Math.abs(kappa) : (2 * Math.asin(h)) / Math.abs(kappa);
}
