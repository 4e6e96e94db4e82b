/**
 * The local helix at the end of a growing track: a circle through the last hit (the anchor)
 * fitted to the last few hits, and a straight line z = z0 + tan λ·s in arc length.
 *
 * Circle: a circle through the anchor is A·r² + B·x + C·y = 0 in coordinates relative to the
 * anchor; it is a straight line A + B·u + C·v = 0 in the conformal plane (u, v) = (x, y)/r²
 * (Hansroul, Jeremie & Savard, NIM A270 (1988) 498 (memory)). With B² + C² = 1 the algebraic
 * residual A·r² + B·x + C·y equals (d² − R²)/(2R) for a hit at distance d from the centre —
 * close to the geometric residual near the arc — so the least-squares problem has no
 * small-radius bias and passes smoothly to a straight line (A = 0). For fixed (B, C) the best A
 * is linear; what remains is the smallest eigenvector of a 2×2 matrix, in closed form. No
 * iteration, no allocation, any turning angle (tight spirals included).
 *
 * The state at the anchor: position, direction of travel (cos φ, sin φ) — the sense is taken so
 * that the previous hit lies behind — and signed curvature κ [1/m], positive for a
 * counter-clockwise turn seen from +z (the lib/fit convention).
 */
export interface RoadState {
  /** Anchor (last hit) [m]. */
  x: number;
  y: number;
  z: number;
  cosPhi: number;
  sinPhi: number;
  kappa: number;
  /** dz/ds and the line's mean arc length, Σ(s − s̄)² and hit count, for the prediction error. */
  tanLambda: number;
  zAtAnchor: number;
  meanS: number;
  sss: number;
  hits: number;
  /** Arc length spanned by the window [m] (≥ 0). */
  lengthM: number;
}

export function createRoadState(): RoadState {
  return { x: 0, y: 0, z: 0, cosPhi: 1, sinPhi: 0, kappa: 0, tanLambda: 0, zAtAnchor: 0, meanS: 0, sss: 0, hits: 0, lengthM: 0 };
}

/**
 * Fits the road state to hits `ids[0]` (anchor), `ids[1]` (the hit before it), … `ids[m−1]`,
 * given as ids[first + j·step] so that the caller can walk its chain either way. Needs m ≥ 2;
 * with m = 2 the road is the straight line through both. `sArc` is scratch of length ≥ m.
 * `along`, when given, is the running arc length [m] of each chain place in chain order (grown
 * with the chain), which spares the arc-length measurement on the fitted circle.
 * Lengths in metres; `hasZ` false leaves the z line flat.
 */
export function fitRoadWindow(
  x: Float64Array, y: Float64Array, z: Float64Array, hasZ: boolean,
  ids: Int32Array, first: number, step: number, m: number, sArc: Float64Array, out: RoadState,
  along?: Float64Array,
): RoadState {
  const h0 = ids[first];
  const ax = x[h0], ay = y[h0];
  const h1 = ids[first + step];
  const bx = x[h1] - ax, by = y[h1] - ay;
  let sxx = 0, sxy = 0, syy = 0, vx = 0, vy = 0, srr = 0;
  // With a running arc length the s–z sums come in the same pass (s and z from the anchor).
  const s0 = along !== undefined ? along[first] : 0, z0 = z[h0];
  let ss = 0, sz = 0, sss = 0, ssz = 0, span = 0;
  for (let j = 1; j < m; j++) {
    const at = first + j * step;
    const h = ids[at];
    const dx = x[h] - ax, dy = y[h] - ay;
    const r2 = dx * dx + dy * dy;
    sxx += dx * dx; sxy += dx * dy; syy += dy * dy;
    vx += r2 * dx; vy += r2 * dy; srr += r2 * r2;
    if (along !== undefined) {
      const s = -step * (along[at] - s0), dz = z[h] - z0;
      ss += s; sz += dz; sss += s * s; ssz += s * dz;
      span = s;
    }
  }
  let qx: number, qy: number, A = 0;
  if (m >= 3 && srr > 0) {
    const m11 = sxx - (vx * vx) / srr, m12 = sxy - (vx * vy) / srr, m22 = syy - (vy * vy) / srr;
    const half = 0.5 * (m11 - m22);
    const lambda = 0.5 * (m11 + m22) - Math.sqrt(half * half + m12 * m12);
    // Eigenvector of the smallest eigenvalue: the better conditioned of the two forms.
    const ex1 = m12, ey1 = lambda - m11, ex2 = lambda - m22, ey2 = m12;
    const n1 = ex1 * ex1 + ey1 * ey1, n2 = ex2 * ex2 + ey2 * ey2;
    if (n1 >= n2 && n1 > 0) { const f = 1 / Math.sqrt(n1); qx = ex1 * f; qy = ey1 * f; }
    else if (n2 > 0) { const f = 1 / Math.sqrt(n2); qx = ex2 * f; qy = ey2 * f; }
    else { const f = 1 / Math.hypot(bx, by); qx = -by * f; qy = bx * f; }
    A = -(qx * vx + qy * vy) / srr;
  } else {
    const f = 1 / Math.hypot(bx, by);
    qx = -by * f; qy = bx * f;
  }
  if (!(Number.isFinite(qx) && Number.isFinite(qy) && Number.isFinite(A))) {
    const f = 1 / Math.hypot(bx, by);
    qx = -by * f; qy = bx * f; A = 0;
  }
  // Tangent ⟂ (B, C), pointing away from the previous hit; κ = −2A·η with η = (B, C)·n.
  let tx = -qy, ty = qx;
  if (tx * bx + ty * by > 0) { tx = -tx; ty = -ty; }
  const eta = qx * -ty + qy * tx;
  const kappa = -2 * A * (eta >= 0 ? 1 : -1);
  out.x = ax; out.y = ay;
  out.cosPhi = tx; out.sinPhi = ty; out.kappa = kappa;
  out.hits = m;
  if (along !== undefined) {
    out.lengthM = Math.abs(span);
    if (hasZ) {
      const ms = ss / m, mz = sz / m;
      const css = sss - m * ms * ms, csz = ssz - m * ms * mz;
      const t = css > 0 ? csz / css : 0;
      out.tanLambda = t; out.zAtAnchor = z0 + mz - t * ms; out.meanS = ms; out.sss = css; out.z = z0;
    } else {
      out.tanLambda = 0; out.zAtAnchor = 0; out.meanS = 0; out.sss = 0; out.z = 0;
    }
    return out;
  }
  // Arc lengths back along the circle (negative), measured on the fitted circle, unwrapped hit
  // to hit past π.
  let prev = 0, turns = 0;
  sArc[0] = 0;
  for (let j = 1; j < m; j++) {
    const h = ids[first + j * step];
    const dx = x[h] - ax, dy = y[h] - ay;
    const a = dx * tx + dy * ty, b = -dx * ty + dy * tx;
    if (kappa === 0) { sArc[j] = a; continue; }
    let psi = Math.atan2(kappa * a, 1 - kappa * b) + turns;
    while (psi - prev > Math.PI) { psi -= 2 * Math.PI; turns -= 2 * Math.PI; }
    while (psi - prev < -Math.PI) { psi += 2 * Math.PI; turns += 2 * Math.PI; }
    prev = psi;
    sArc[j] = psi / kappa;
  }
  out.lengthM = Math.abs(sArc[m - 1]);
  out.hits = m;
  if (hasZ) {
    let ms = 0, mz = 0;
    for (let j = 0; j < m; j++) { ms += sArc[j]; mz += z[ids[first + j * step]]; }
    ms /= m; mz /= m;
    let sss = 0, ssz = 0;
    for (let j = 0; j < m; j++) {
      const ds = sArc[j] - ms;
      sss += ds * ds;
      ssz += ds * (z[ids[first + j * step]] - mz);
    }
    const t = sss > 0 ? ssz / sss : 0;
    out.tanLambda = t;
    out.zAtAnchor = mz - t * ms;
    out.meanS = ms;
    out.sss = sss;
    out.z = z[h0];
  } else {
    out.tanLambda = 0; out.zAtAnchor = 0; out.meanS = 0; out.sss = 0; out.z = 0;
  }
  return out;
}
