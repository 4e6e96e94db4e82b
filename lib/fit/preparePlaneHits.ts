/** Hit coordinates [m] and optional per-hit errors [m] as typed-array columns. */
export interface PlaneHits {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly sigmaX?: Float64Array;
  readonly sigmaY?: Float64Array;
}

const PREPARED = Symbol('sagitta.preparedPlaneHits');

/**
 * Hits made ready for repeated fitting: per-hit weights w = 2/(σx² + σy²) (= 1/σ² for round
 * errors; 1 for every hit when the hits carry no errors, which `errorsKnown` then says) computed once, whether any hit has σx ≠ σy (then the geometric fit weighs each residual
 * by the error along its own direction), and whether every number is usable (finite coordinates,
 * positive finite errors) — when it is, the fits skip the per-track screen.
 *
 * `fitCircles` prepares plain hits itself; prepare once yourself when the same hits are fitted
 * several times (comparing fitters, scanning options). Do not change the arrays afterwards.
 */
export interface PreparedPlaneHits extends PlaneHits {
  readonly weights: Float64Array;
  /** False when the hits carry no errors: the fits then estimate them from the residuals. */
  readonly errorsKnown: boolean;
  readonly anisotropic: boolean;
  readonly allUsable: boolean;
  readonly [PREPARED]: true;
}

export function isPreparedPlaneHits(hits: PlaneHits): hits is PreparedPlaneHits {
  return (hits as Partial<PreparedPlaneHits>)[PREPARED] === true;
}

/** @example const prepared = preparePlaneHits(hits); fitCircles(prepared, offsets, { method: 'kasa' }) */
export function preparePlaneHits(hits: PlaneHits): PreparedPlaneHits {
  if (isPreparedPlaneHits(hits)) return hits;
  const { x, y } = hits;
  const sx = hits.sigmaX;
  const sy = hits.sigmaY ?? sx;
  const n = x.length;
  let weights: Float64Array;
  let anisotropic = false;
  // v·0 is 0 for finite v and NaN for ±Infinity or NaN, so one sum screens a column.
  let acc = 0;
  for (let i = 0; i < n; i++) acc += x[i] * 0 + y[i] * 0;
  let allUsable = acc === 0;
  if (sx !== undefined) {
    weights = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const ex = sx[i], ey = sy![i];
      weights[i] = 2 / (ex * ex + ey * ey);
      if (ex !== ey) anisotropic = true;
      allUsable = allUsable && ex > 0 && ey > 0 && ex < Infinity && ey < Infinity;
    }
  } else {
    weights = new Float64Array(n).fill(1);
  }
  return { x, y, sigmaX: sx, sigmaY: sy, weights, errorsKnown: sx !== undefined, anisotropic, allUsable, [PREPARED]: true };
}
