import type { RoadContext } from './roadContext.js';
import { fitRoadWindow } from './roadWindow.js';

/**
 * Road following (track following): extends the candidate chain[head … tail] hit by hit at one
 * end — `dir` +1 after `tail`, −1 before `head` — and returns the new end index.
 *
 * Each step fits the local helix to the last `window` hits (roadWindow.ts), predicts every hit
 * of the grid cells near the end, and takes the nearest one ahead in arc length whose χ² against
 * the prediction passes `chi2Cut` (bending-plane residual and, with z, the z residual; 2 dof).
 * The prediction variance grows with the step u = Δs/L over a window of arc length L and m hits
 * as for a least-squares parabola on uniform points, σ²(1/m + 12u²/m + 180u⁴/(m + 4)) scaled
 * to the anchored fit (anchor + candidate errors), plus a scattering allowance (θ·Δs)².
 * The near field (Δs ≤ nearStepM) is searched first; the full road (≤ maxStepM, a few missing
 * hits) only when the near field has nothing. Hits already held by a found track may be passed
 * through (shared hits); a run of `maxSharedRun` of them in a row means the road has joined
 * that track: the run is taken back and the following stops. When the tracks are known to start
 * at a common point (`originRadiusM` > 0), no step may pass within that radius of it: two
 * tracks leaving it back to back would otherwise make one smooth road.
 * The method is the local "track following" of pattern recognition (Mankel, Rep. Prog. Phys.
 * 67 (2004) 553, review (memory)), with a Kalman-like χ² gate on the predicted helix.
 */
export function followRoad(ctx: RoadContext, head: number, tail: number, dir: 1 | -1): number {
  const { x, y, z, hasZ, grid, owner, mark, stamp, chain, chainS, sArc, state: st, settings: o } = ctx;
  const { start, hits: cellHits, nx, ny, x0, y0 } = grid;
  const inv = 1 / grid.cellM;
  const sig2 = o.sigmaM * o.sigmaM, sigZ2 = o.sigmaZM * o.sigmaZM;
  let end = dir > 0 ? tail : head;
  let length = tail - head + 1;
  let sharedRun = 0;
  // A full window is refitted every second step; in between the last fit is carried to the new
  // hit along its own helix (direction turned by κ·Δs, z line moved by Δs), which halves the cost
  // with no loss that the tests can see.
  let carried = false;
  for (;;) {
    const m = Math.min(o.window, length);
    if (!carried) fitRoadWindow(x, y, z, hasZ, chain, end, -dir, m, sArc, st, chainS);
    const kappa = st.kappa, c = st.cosPhi, s = st.sinPhi, t = st.tanLambda;
    const stretch = hasZ ? Math.sqrt(1 + t * t) : 1;
    const lever = Math.max(st.lengthM, o.spacingM);
    // Near the tracks' common start point a road must not step across it onto another track.
    const ox = o.originM[0], oy = o.originM[1], oz = o.originM[2];
    const guardOrigin = o.originRadiusM > 0 && (st.x - ox) ** 2 + (st.y - oy) ** 2 + (hasZ ? (st.z - oz) ** 2 : 0) < (o.maxStepM + o.originRadiusM) ** 2;
    let best = -1, bestS = Infinity;
    for (let stage = 0; stage < 2 && best < 0; stage++) {
      const reach = stage === 0 ? o.nearStepM : o.maxStepM, reach2 = reach * reach;
      const i0 = Math.max(0, Math.floor((st.x - reach - x0) * inv)), i1 = Math.min(nx - 1, Math.floor((st.x + reach - x0) * inv));
      const j0 = Math.max(0, Math.floor((st.y - reach - y0) * inv)), j1 = Math.min(ny - 1, Math.floor((st.y + reach - y0) * inv));
      for (let j = j0; j <= j1; j++) {
        for (let cell = j * nx + i0, last = j * nx + i1; cell <= last; cell++) {
          for (let q = start[cell], qEnd = start[cell + 1]; q < qEnd; q++) {
            const h = cellHits[q];
            if (mark[h] === stamp) continue;
            const dx = x[h] - st.x, dy = y[h] - st.y;
            // Cheap screens first: within reach (a chord is never longer than its arc), and, in
            // the near field (less than a quarter turn even on the tightest road), ahead.
            if (dx * dx + dy * dy > reach2) continue;
            const a = dx * c + dy * s;
            if (stage === 0 && a <= 0) continue;
            const b = -dx * s + dy * c;
            const ds = kappa === 0 ? a : Math.atan2(kappa * a, 1 - kappa * b) / kappa;
            if (!(ds > 0) || ds * stretch > reach || ds >= bestS) continue;
            const U = kappa * (a * a + b * b) - 2 * b;
            const eps = U / (1 + Math.sqrt(Math.max(0, 1 + kappa * U)));
            const u = ds / lever, u2 = u * u;
            const ms = o.scatterRad * ds * stretch;
            const grow = 1 + (12 * u2) / m + (180 * u2 * u2) / (m + 4);
            let chi2 = (eps * eps) / (sig2 * (1 + grow) + ms * ms);
            if (hasZ) {
              const dz = z[h] - (st.zAtAnchor + t * ds);
              const off = ds - st.meanS;
              const varZ = sigZ2 * (1 + 1 / m + (st.sss > 0 ? (off * off) / st.sss : 0)) + ms * ms * stretch * stretch;
              chi2 += (dz * dz) / varZ;
            }
            if (chi2 > o.chi2Cut) continue;
            if (guardOrigin && crossesOrigin(st.x, st.y, hasZ ? st.z : 0, x[h], y[h], hasZ ? z[h] : 0, ox, oy, hasZ ? oz : 0, o.originRadiusM)) continue;
            best = h;
            bestS = ds;
          }
        }
      }
    }
    if (best < 0) break;
    chainS[end + dir] = chainS[end] + dir * bestS;
    end += dir;
    chain[end] = best;
    carried = !carried && length >= o.window;
    if (carried) {
      const turn = kappa * bestS, ct = Math.cos(turn), sn = Math.sin(turn);
      st.cosPhi = c * ct - s * sn; st.sinPhi = s * ct + c * sn;
      st.x = x[best]; st.y = y[best];
      st.zAtAnchor += t * bestS; st.meanS -= bestS; st.z = z[best];
    }
    mark[best] = stamp;
    length++;
    if (owner[best] >= 0) {
      if (++sharedRun >= o.maxSharedRun) {
        // The road has joined a found track: take the shared run back and stop.
        for (let k = 0; k < sharedRun; k++) { mark[chain[end]] = 0; end -= dir; }
        break;
      }
    } else sharedRun = 0;
  }
  return end;
}

/** True when the straight step from a to b passes within r of the point o, between a and b. */
function crossesOrigin(ax: number, ay: number, az: number, bx: number, by: number, bz: number, ox: number, oy: number, oz: number, r: number): boolean {
  const vx = bx - ax, vy = by - ay, vz = bz - az;
  const v2 = vx * vx + vy * vy + vz * vz;
  if (!(v2 > 0)) return false;
  const t = ((ox - ax) * vx + (oy - ay) * vy + (oz - az) * vz) / v2;
  if (!(t > 0 && t < 1)) return false;
  const px = ax + t * vx - ox, py = ay + t * vy - oy, pz = az + t * vz - oz;
  return px * px + py * py + pz * pz < r * r;
}
