import { msg } from '../errors.js';
import { chi2Survival } from './chi2Survival.js';

/** The inverse-variance weighted mean of measurements, with its error and their consistency. */
export interface WeightedMean {
  readonly mean: number;
  /** 1σ error of the mean, 1/√Σwᵢ (wᵢ = 1/σᵢ²). */
  readonly error: number;
  /** Σ ((xᵢ − mean)/σᵢ)². */
  readonly chi2: number;
  readonly ndf: number;
  readonly pValue: number;
  /** √(χ²/ndf) when above 1, else 1: the factor by which the PDG scales the error of an inconsistent average. */
  readonly scaleFactor: number;
  /** Measurements left out because a value or error was not finite, or an error not > 0. */
  readonly excluded: number;
}

/**
 * Weighted mean x̄ = Σ wᵢxᵢ / Σ wᵢ with wᵢ = 1/σᵢ² and error 1/√Σwᵢ, with the χ² of the
 * measurements about it and the PDG scale factor S = √(χ²/(N − 1)) (PDG RPP, Introduction,
 * §5.2 "Averages and fits"; the PDG applies S to the error when S > 1 — here S is reported and
 * the error left unscaled). Requires at least one usable measurement.
 * @example weightedMean([10.1, 9.8, 10.3], [0.2, 0.3, 0.4]).mean // ≈ 10.04
 */
export function weightedMean(values: ArrayLike<number>, errors: ArrayLike<number>): WeightedMean {
  if (values.length !== errors.length) throw msg.badArgument('errors', `${errors.length} errors`, `one error per value (${values.length})`);
  let sw = 0, swx = 0, used = 0;
  for (let i = 0; i < values.length; i++) {
    const x = values[i], s = errors[i];
    if (!Number.isFinite(x) || !(s > 0) || !Number.isFinite(s)) continue;
    const w = 1 / (s * s);
    sw += w; swx += w * x; used++;
  }
  if (used === 0) throw msg.badArgument('values', `${values.length} values`, 'at least one finite value with a finite error > 0');
  const mean = swx / sw;
  let chi2 = 0;
  for (let i = 0; i < values.length; i++) {
    const x = values[i], s = errors[i];
    if (!Number.isFinite(x) || !(s > 0) || !Number.isFinite(s)) continue;
    chi2 += ((x - mean) / s) ** 2;
  }
  const ndf = used - 1;
  return Object.freeze({
    mean, error: 1 / Math.sqrt(sw), chi2, ndf,
    pValue: ndf > 0 ? chi2Survival(chi2, ndf) : NaN,
    scaleFactor: ndf > 0 ? Math.max(1, Math.sqrt(chi2 / ndf)) : 1,
    excluded: values.length - used,
  });
}
