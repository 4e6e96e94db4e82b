import { msg } from '../errors.js';
import { fitCircle } from '../fit/fitCircles.js';
import { pathLengthsM } from './pathLength.js';

/** The hits of one track in travel order (coordinates [m]); errors per hit when known. */
export interface SegmentHits {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly z?: Float64Array;
  readonly sigmaX?: Float64Array;
}

export interface SegmentCurvatureOptions {
  /** Hits per segment (≥ 4); default 8. */
  readonly hitsPerSegment?: number;
  /**
   * 'consecutive' (default): disjoint segments, independent measurement errors — what a
   * likelihood needs; 'sliding': a window moved by one hit (smooth figures; neighbours correlated).
   */
  readonly mode?: 'consecutive' | 'sliding';
  /** Hit error [m] when the hits carry none; omitted → 200 µm. */
  readonly hitErrorM?: number;
}

export const SEGMENT_CURVATURE_DEFAULTS = Object.freeze({ hitsPerSegment: 8, mode: 'consecutive' as const, hitErrorM: 200e-6 });

/** Curvature of each segment of a track, with its measurement error and where it sits. */
export interface SegmentCurvatures {
  readonly count: number;
  /** Signed curvature of the segment's circle fit [1/m] (sign as `fitCircle`). */
  readonly kappa: Float64Array;
  /** Its error from the hit errors alone [1/m] (fit covariance; no multiple scattering). */
  readonly sigmaKappa: Float64Array;
  /** Path length [m] from the first hit to the segment's middle. */
  readonly pathMidM: Float64Array;
  /** cos λ of the segment: bending-plane path over 3-D path (1 without z). */
  readonly cosLambda: Float64Array;
  /** First hit and one past the last hit of each segment. */
  readonly from: Int32Array;
  readonly to: Int32Array;
  /** Path length [m] at every hit (3-D), from the first hit. */
  readonly pathM: Float64Array;
}

/**
 * Splits a track into segments of `hitsPerSegment` hits and fits a circle to each (geometric
 * fit with the hit errors), giving curvature along the track with errors: on a slowing track
 * κ = 0.2998·B·|z|/(p cos λ) grows towards the end (common practice). In 'consecutive' mode a
 * remainder of fewer than hitsPerSegment/2 hits joins the last segment. Multiple scattering
 * inside a segment is not in `sigmaKappa`; `identifyTrack` adds it per hypothesis.
 * Valid for segments shorter than about one turn.
 * @example segmentCurvatures(trackHits(tracks, 0), { hitsPerSegment: 8 }).kappa
 */
export function segmentCurvatures(hits: SegmentHits, options: SegmentCurvatureOptions = {}): SegmentCurvatures {
  const d = SEGMENT_CURVATURE_DEFAULTS;
  const o = { hitsPerSegment: options.hitsPerSegment ?? d.hitsPerSegment, mode: options.mode ?? d.mode, hitErrorM: options.hitErrorM ?? d.hitErrorM };
  if (!Number.isInteger(o.hitsPerSegment) || o.hitsPerSegment < 4) throw msg.badArgument('hitsPerSegment', o.hitsPerSegment, 'a whole number of hits ≥ 4');
  const n = hits.x.length;
  const path = pathLengthsM(hits.x, hits.y, hits.z);
  const bounds = segmentBounds(n, o.hitsPerSegment, o.mode);
  const m = bounds.length;
  const out = {
    kappa: new Float64Array(m), sigmaKappa: new Float64Array(m), pathMidM: new Float64Array(m),
    cosLambda: new Float64Array(m), from: new Int32Array(m), to: new Int32Array(m),
  };
  for (let j = 0; j < m; j++) {
    const [a, b] = bounds[j];
    const sigma = hits.sigmaX ? hits.sigmaX.subarray(a, b) : o.hitErrorM;
    const fit = fitCircle(hits.x.subarray(a, b), hits.y.subarray(a, b), { sigma });
    out.from[j] = a; out.to[j] = b;
    out.kappa[j] = fit.status === 'ok' ? fit.kappa : NaN;
    out.sigmaKappa[j] = fit.status === 'ok' ? Math.sqrt(fit.cov[0]) : NaN;
    out.pathMidM[j] = 0.5 * (path[a] + path[b - 1]);
    let sxy = 0;
    for (let i = a + 1; i < b; i++) sxy += Math.hypot(hits.x[i] - hits.x[i - 1], hits.y[i] - hits.y[i - 1]);
    const s3 = path[b - 1] - path[a];
    out.cosLambda[j] = s3 > 0 ? Math.min(1, sxy / s3) : 1;
  }
  return Object.freeze({ count: m, ...out, pathM: path });
}

function segmentBounds(n: number, size: number, mode: 'consecutive' | 'sliding'): [number, number][] {
  const bounds: [number, number][] = [];
  if (n < size) return n >= 4 ? [[0, n]] : bounds;
  if (mode === 'sliding') {
    for (let a = 0; a + size <= n; a++) bounds.push([a, a + size]);
    return bounds;
  }
  for (let a = 0; a + size <= n; a += size) bounds.push([a, a + size]);
  const rest = n - bounds[bounds.length - 1][1];
  if (rest >= Math.max(4, size / 2)) bounds.push([n - rest, n]);
  else bounds[bounds.length - 1][1] = n;
  return bounds;
}
