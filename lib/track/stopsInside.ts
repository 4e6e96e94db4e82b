import type { SegmentCurvatures } from './segmentCurvatures.js';

/** An axis-aligned box [m]: the fiducial volume of a chamber. */
export interface FiducialBox {
  readonly min: readonly [number, number, number];
  readonly max: readonly [number, number, number];
}

export interface StopsInsideOptions {
  /** The chamber's sensitive volume; omitted → only the curvature criterion is used. */
  readonly volume?: FiducialBox;
  /** The end point must be this far inside every face of `volume` [m]; default 2 cm. */
  readonly marginM?: number;
  /** Without a volume: least significance of the curvature slope along the track; default 3. */
  readonly minRise?: number;
}

export const STOPS_INSIDE_DEFAULTS = Object.freeze({ marginM: 0.02, minRise: 3 });

export interface StopDecision {
  readonly stops: boolean;
  /** End point inside the volume shrunk by the margin (true without a volume). */
  readonly endInside: boolean;
  /** Slope of |κ| along the path over its error (segment fits, measurement errors only). */
  readonly riseSignificance: number;
}

/**
 * Whether a track stops inside the chamber. Criterion (ours, documented): with a fiducial
 * `volume`, the last hit lies inside it by at least `marginM` on every face, so the particle did
 * not leave through a wall (a track that ends inside either stopped, interacted or decayed in
 * flight, or lost its hits; the range term of `identifyTrack` then tests the first). Without a
 * volume, the curvature must rise along the track: the weighted straight-line slope of the
 * segment curvatures |κ_j| against path must exceed `minRise` standard deviations (measurement
 * errors only), as it does when the momentum falls towards zero (κ ∝ 1/p, common practice).
 * `riseSignificance` is reported in both cases; it is NaN below two segments.
 * @example stopsInside(segmentCurvatures(hits), [x, y, z], { volume })
 */
export function stopsInside(seg: SegmentCurvatures, end: readonly [number, number, number], options: StopsInsideOptions = {}): StopDecision {
  const o = { volume: options.volume, marginM: options.marginM ?? STOPS_INSIDE_DEFAULTS.marginM, minRise: options.minRise ?? STOPS_INSIDE_DEFAULTS.minRise };
  const endInside = o.volume ? insideBy(end[0], end[1], end[2], o.volume, o.marginM) : true;
  const rise = curvatureSlopeSignificance(seg);
  const stops = o.volume ? endInside : rise >= o.minRise;
  return Object.freeze({ stops, endInside, riseSignificance: rise });
}

/** Whether (x, y, z) [m] lies inside `volume` by at least `marginM` on every face (z NaN: the bending plane only). */
function insideBy(x: number, y: number, z: number, volume: FiducialBox, marginM: number): boolean {
  const c = [x, y, z];
  for (let a = 0; a < 3; a++) {
    if (a === 2 && Number.isNaN(z)) continue;
    if (!(c[a] >= volume.min[a] + marginM && c[a] <= volume.max[a] - marginM)) return false;
  }
  return true;
}

/**
 * Per track (track k is rows [offsets[k], offsets[k+1]) of the hit columns, in travel order): 1
 * when its last hit lies inside `volume` by at least `marginM` on every face (default 2 cm, the
 * criterion of `stopsInside` with a volume); without z only x and y are tested. A track that ends
 * inside stopped, interacted or decayed in flight, or lost its hits; the fit with material's stop
 * constraint (`stops`) then tests the first through its χ².
 * @example endsInside(tracks.hits, tracks.offsets, { min: [-0.8, -0.5, -0.3], max: [0.8, 0.5, 0.3] })
 */
export function endsInside(hits: { readonly x: Float64Array; readonly y: Float64Array; readonly z?: Float64Array }, offsets: Int32Array, volume: FiducialBox, marginM: number = STOPS_INSIDE_DEFAULTS.marginM): Uint8Array {
  const n = offsets.length - 1;
  const out = new Uint8Array(Math.max(0, n));
  for (let k = 0; k < n; k++) {
    const last = offsets[k + 1] - 1;
    if (last < offsets[k]) continue;
    out[k] = insideBy(hits.x[last], hits.y[last], hits.z ? hits.z[last] : NaN, volume, marginM) ? 1 : 0;
  }
  return out;
}

/** Slope of |κ| against path over its error (weighted least squares); NaN below two segments. */
export function curvatureSlopeSignificance(seg: SegmentCurvatures): number {
  let sw = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, m = 0;
  let sign = 0;
  for (let j = 0; j < seg.count; j++) if (Number.isFinite(seg.kappa[j])) sign += seg.kappa[j] / seg.sigmaKappa[j] ** 2;
  sign = sign < 0 ? -1 : 1;
  for (let j = 0; j < seg.count; j++) {
    const k = seg.kappa[j] * sign, e = seg.sigmaKappa[j];
    if (!Number.isFinite(k) || !(e > 0)) continue;
    const w = 1 / (e * e), x = seg.pathMidM[j];
    sw += w; sx += w * x; sy += w * k; sxx += w * x * x; sxy += w * x * k; m++;
  }
  const det = sw * sxx - sx * sx;
  if (m < 2 || !(det > 0)) return NaN;
  return ((sw * sxy - sx * sy) / det) / Math.sqrt(sw / det);
}
