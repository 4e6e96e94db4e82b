import { allocateCircleFits, STATUS_CODE, type CircleFitColumns } from './circleFit.js';
import type { PreparedPlaneHits } from './preparePlaneHits.js';
import type { TrackSpan } from './trackSpan.js';

/** Fits one screened track (≥ 3 hits, usable numbers) into slot k. */
export type CircleKernel = (span: TrackSpan, out: CircleFitColumns, k: number) => void;

/**
 * The loop every circle method shares: track k is rows [offsets[k], offsets[k+1]); a track with
 * fewer than 3 hits or unusable numbers (non-finite coordinates, errors not positive and
 * finite) gets its status and NaN parameters; every other track goes to `kernel`. The span is
 * reused from track to track, so nothing is allocated per track.
 */
export function fitCircleBatch(hits: PreparedPlaneHits, offsets: Int32Array, kernel: CircleKernel): CircleFitColumns {
  const count = offsets.length - 1;
  const out = allocateCircleFits(count);
  const span: TrackSpan = { hits, from: 0, to: 0 };
  for (let k = 0; k < count; k++) {
    const from = offsets[k], to = offsets[k + 1];
    const problem = to - from < 3 ? STATUS_CODE['too-few-hits'] : hits.allUsable ? STATUS_CODE.ok : screenTrack(hits, from, to);
    if (problem !== STATUS_CODE.ok) {
      markFailed(out, k, problem, to - from);
      continue;
    }
    span.from = from;
    span.to = to;
    kernel(span, out, k);
  }
  return out;
}

/**
 * Screen of one track (used only when the table-wide screen found a bad number): finite
 * coordinates, positive finite errors. (Hits all on one point are caught by the fits themselves,
 * which find no circle.)
 */
function screenTrack(hits: PreparedPlaneHits, from: number, to: number): number {
  const { x, y, sigmaX: sx } = hits;
  const sy = hits.sigmaY ?? sx;
  // v·0 is 0 for finite v and NaN for ±Infinity or NaN, so one sum screens them all.
  let acc = 0;
  for (let i = from; i < to; i++) acc += x[i] * 0 + y[i] * 0;
  if (acc !== 0) return STATUS_CODE['bad-input'];
  if (sx !== undefined) {
    let bad = false;
    for (let i = from; i < to; i++) {
      const ex = sx[i], ey = sy![i];
      bad = bad || !(ex > 0 && ey > 0 && ex < Infinity && ey < Infinity);
    }
    if (bad) return STATUS_CODE['bad-input'];
  }
  return STATUS_CODE.ok;
}

/** Slot k as a failed fit: NaN parameters, the status, ndf from the hit count. */
export function markFailed(out: CircleFitColumns, k: number, status: number, nhits: number): void {
  out.kappa[k] = NaN;
  out.phi0[k] = NaN;
  out.d0[k] = NaN;
  out.xRef[k] = NaN;
  out.yRef[k] = NaN;
  out.chi2[k] = NaN;
  out.ndf[k] = Math.max(0, nhits - 3);
  out.status[k] = status;
  out.cov.fill(NaN, 6 * k, 6 * k + 6);
}
