import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { rangeAtKinetic, kineticAndStoppingAtRange, type LossModel } from './lossModel.js';
import type { MatterTrackHits } from './matterTrackFit.js';

/**
 * Start state (x, y, φ, κ, z, tan λ) of the fit at the first hit, written to `out`: the circle
 * through the first, middle and last hits (its curvature is a mean over the track), the dip from
 * the z change over the arc. With energy loss the curvature is moved to the first hit: the
 * momentum there is the one whose CSDA range exceeds that of the mean momentum by half the
 * path, and at least 1.05 times the whole path, so that the start reaches every hit. A rough
 * start is enough: the fit iterates from it. False when the hits are degenerate. `tmp`: 3 numbers
 * of scratch (the table hint in tmp[2]).
 */
export function seedState(hits: MatterTrackHits, model: LossModel, fieldT: number, energyLoss: boolean, out: Float64Array, tmp: Float64Array): boolean {
  const n = hits.x.length, x = hits.x, y = hits.y;
  const m = n >> 1;
  const ax = x[m] - x[0], ay = y[m] - y[0], bx = x[n - 1] - x[0], by = y[n - 1] - y[0];
  const cx = x[n - 1] - x[m], cy = y[n - 1] - y[m];
  const la = Math.sqrt(ax * ax + ay * ay), lb = Math.sqrt(bx * bx + by * by), lc = Math.sqrt(cx * cx + cy * cy);
  if (!(la > 0 && lb > 0 && lc > 0)) return false;
  const kappa = (2 * (ax * by - ay * bx)) / (la * lb * lc);
  // Chord direction to the middle hit is φ + κ·arc/2.
  const halfTurn = 0.5 * kappa * arcOfChord(la, kappa);
  const phi = Math.atan2(ay, ax) - halfTurn;
  let path = 0;
  for (let i = 1; i < n; i++) {
    const dx = x[i] - x[i - 1], dy = y[i] - y[i - 1];
    path += Math.sqrt(dx * dx + dy * dy);
  }
  const tanL = hits.z ? (hits.z[n - 1] - hits.z[0]) / arcOfChord(lb, kappa) : 0;
  out[0] = x[0]; out[1] = y[0]; out[2] = phi; out[3] = kappa; out[4] = hits.z ? hits.z[0] : 0; out[5] = Number.isFinite(tanL) ? tanL : 0;
  if (energyLoss && kappa !== 0) {
    const secL = Math.sqrt(1 + out[5] * out[5]);
    const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(fieldT) * secL;
    const pMeV = (1000 * cK) / Math.abs(kappa), mass = model.massMeV;
    const rMean = rangeAtKinetic(model, Math.sqrt(pMeV * pMeV + mass * mass) - mass);
    const pathGcm2 = path * secL * model.gcm2PerM;
    if (Number.isFinite(rMean)) {
      const r0 = Math.max(rMean + 0.5 * pathGcm2, 1.05 * pathGcm2);
      kineticAndStoppingAtRange(model, r0, tmp);
      const p0 = Math.sqrt(tmp[0] * (tmp[0] + 2 * mass)) / 1000;
      out[3] = (Math.sign(kappa) * cK) / p0;
    }
  }
  return Number.isFinite(out[2] + out[3]);
}

/** Arc length of a chord c on a circle of curvature κ. */
function arcOfChord(c: number, kappa: number): number {
  const h = 0.5 * c * Math.abs(kappa);
  return h < 1e-6 ? c : h >= 1 ? Math.PI / Math.abs(kappa) : (2 * Math.asin(h)) / Math.abs(kappa);
}
