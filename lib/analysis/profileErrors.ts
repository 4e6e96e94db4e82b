import { minimiseObjective, type FitMinimum, type FitObjective, type MinimiseSettings } from './fitObjective.js';

/**
 * Likelihood-ratio (profile) errors of the free parameters: for each, the distances below and
 * above the best value where the objective, minimised over all other free parameters, has
 * risen by `up` (1 in χ² units: the 68.27 % interval of one parameter; common practice, PDG RPP
 * "Statistics", §40.3.2.1). Each side is found by secant steps on √ΔF, which is linear in the
 * parameter for a Gaussian likelihood, starting at the curvature error; 1e-3 in ΔF is enough.
 * Where a bound stops the scan before ΔF reaches `up`, the distance to the bound is returned.
 * `covariance` (free × free) seeds the other parameters along the correlation.
 */
export function profileErrors(
  objective: FitObjective,
  minimum: FitMinimum,
  free: Int32Array,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  covariance: Float64Array,
  up = 1,
  settings: MinimiseSettings = { absoluteTolerance: 1e-9 * up, precise: false },
): { lower: Float64Array; upper: Float64Array } {
  const p = free.length;
  const out = { lower: new Float64Array(p).fill(NaN), upper: new Float64Array(p).fill(NaN) };
  for (let j = 0; j < p; j++) {
    const sigma = Math.sqrt(covariance[j * p + j]);
    if (!(sigma > 0)) continue;
    const others = Int32Array.from(free.filter((_, k) => k !== j));
    const lo = Float64Array.from(others, (i) => lower[free.indexOf(i)]);
    const hi = Float64Array.from(others, (i) => upper[free.indexOf(i)]);
    const best = minimum.full[free[j]];
    for (const side of [-1, 1] as const) {
      const limit = side < 0 ? lower[j] : upper[j];
      const rise = (distance: number): number => {
        const start = Float64Array.from(minimum.full);
        const v = best + side * distance;
        start[free[j]] = v;
        for (let k = 0; k < p; k++) if (k !== j) start[free[k]] = clamp(minimum.full[free[k]] + (covariance[k * p + j] / (sigma * sigma)) * (v - best), lower[k], upper[k]);
        return minimiseObjective(objective, start, others, lo, hi, settings).value - minimum.value;
      };
      const room = Math.abs(limit - best);
      let d1 = Math.min(sigma, room), q1 = Math.sqrt(Math.max(rise(d1), 0)) - Math.sqrt(up);
      let d0 = 0, q0 = -Math.sqrt(up);
      let found = Math.abs(q1) < 1e-3 ? d1 : NaN;
      for (let it = 0; it < 20 && Number.isNaN(found); it++) {
        if (d1 >= room && q1 < 0) { found = room; break; } // the bound comes first
        let next = q1 === q0 ? 2 * d1 : d1 - (q1 * (d1 - d0)) / (q1 - q0);
        if (!(next > 0) || !Number.isFinite(next)) next = 2 * d1;
        next = Math.min(next, room, 10 * d1);
        d0 = d1; q0 = q1;
        d1 = next;
        q1 = Math.sqrt(Math.max(rise(d1), 0)) - Math.sqrt(up);
        if (Math.abs(q1) < 5e-4) found = d1;
      }
      (side < 0 ? out.lower : out.upper)[j] = found;
    }
  }
  return out;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
