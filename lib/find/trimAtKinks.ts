import type { RoadContext } from './roadContext.js';
import { fitRoadWindow } from './roadWindow.js';

/**
 * A road may leave its track and join another one that happens to continue it — most often two
 * tracks leaving a common vertex nearly back to back, which make one smooth line through the
 * vertex. Such a join shows as a change of curvature or of dip. At every place g of the
 * candidate chain[head … tail], helices are fitted on up to `side` hits on each side (each
 * walking away from g, so one helix traversed both ways has κ₁ = −κ₂ and tan λ₁ = −tan λ₂);
 * where the largest difference exceeds `significance` standard deviations the chain is cut,
 * keeping the part that holds the seed hit `keep`, and the kept part is scanned again. Curvature errors: Gluckstern, NIM 24 (1963)
 * 381, σκ = σ/L²·√(720/(N + 4)), doubled for the fit anchored on a measured hit; dip errors
 * σ_z/√Σ(s − s̄)². Returns the new [head, tail].
 */
export function trimAtKinks(ctx: RoadContext, head: number, tail: number, keep: number, scratch: { sArc: Float64Array }, out: Int32Array): Int32Array {
  const { x, y, z, hasZ, chain, chainS, state: st, settings: o } = ctx;
  const side = 16, significance = 5, minSide = 6, stride = 2;
  if (scratch.sArc.length < side) scratch.sArc = new Float64Array(side);
  let lo = head, hi = tail;
  for (let pass = 0; pass < 8; pass++) {
    let worst = significance, cut = -1;
    for (let g = lo + minSide - 1; g + minSide <= hi; g += stride) {
      const left = Math.min(side, g - lo + 1), right = Math.min(side, hi - g);
      fitRoadWindow(x, y, z, hasZ, chain, g, -1, left, scratch.sArc, st, chainS);
      const k1 = st.kappa, l1 = st.lengthM, t1 = st.tanLambda, st1 = st.sss;
      fitRoadWindow(x, y, z, hasZ, chain, g + 1, 1, right, scratch.sArc, st, chainS);
      const k2 = st.kappa, l2 = st.lengthM, t2 = st.tanLambda, st2 = st.sss;
      const e1 = (2 * o.sigmaM * Math.sqrt(720 / (left + 4))) / (l1 * l1);
      const e2 = (2 * o.sigmaM * Math.sqrt(720 / (right + 4))) / (l2 * l2);
      // A scattering allowance on the curvature: the angle θ over each side's length.
      const m1 = o.scatterRad / Math.max(l1, o.spacingM), m2 = o.scatterRad / Math.max(l2, o.spacingM);
      let score = Math.abs(k1 + k2) / Math.sqrt(e1 * e1 + e2 * e2 + m1 * m1 + m2 * m2);
      if (hasZ && st1 > 0 && st2 > 0) {
        const et = o.sigmaZM * Math.sqrt(1 / st1 + 1 / st2);
        score = Math.max(score, Math.abs(t1 + t2) / Math.hypot(et, o.scatterRad));
      }
      if (score > worst) { worst = score; cut = g; }
    }
    if (cut < 0) break;
    if (keep <= cut) hi = cut;
    else lo = cut + 1;
  }
  out[0] = lo; out[1] = hi;
  return out;
}
