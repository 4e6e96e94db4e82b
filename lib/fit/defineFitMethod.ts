import { msg } from '../errors.js';
import { fitCircleBatch } from './circleBatch.js';
import { STATUS_CODE } from './circleFit.js';
import type { CircleFitMethod } from './fitMethod.js';

/** One track's hits as a method written with `defineFitMethod` sees them (views: do not keep them). */
export interface TrackHits {
  /** Bending-plane coordinates [m], in travel order. */
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Per-hit error [m] (√((σx² + σy²)/2)); undefined when the hits carry no errors. */
  readonly sigma: Float64Array | undefined;
}

/**
 * What a per-track method returns. Only `kappa` is required; give `phi0` and `d0` (at the first
 * hit, lib/fit convention) for the helix step and event displays, `sigmaKappa` or the full
 * (κ, φ0, d0) covariance for pulls and momentum errors, `chi2`/`ndf` for fit quality.
 */
export interface TrackFitResult {
  /** Signed curvature κ [1/m], > 0 when the track turns counter-clockwise seen from +z. */
  readonly kappa: number;
  readonly phi0?: number;
  readonly d0?: number;
  /** σ(κ) [1/m]; ignored when `cov` is given. */
  readonly sigmaKappa?: number;
  /** Upper triangle of the (κ, φ0, d0) covariance: κκ, κφ, κd, φφ, φd, dd. */
  readonly cov?: ArrayLike<number>;
  readonly chi2?: number;
  readonly ndf?: number;
  /** False when the method could not fit this track; default true. */
  readonly ok?: boolean;
  readonly iterations?: number;
}

export interface FitMethodSpec {
  /** Registry name: lower-case letters, digits and dashes. */
  readonly name: string;
  /** One line for tables and help, with the method's reference if it has one. */
  readonly summary?: string;
  fitTrack(track: TrackHits): TrackFitResult;
}

/**
 * Turns a per-track fit function (e.g. one written in a notebook cell) into a registry method
 * that runs on whole hit tables like the built-ins: screened hits, one call per track, results
 * in the same columns. A call that throws, returns `ok: false` or a non-finite κ marks that track
 * `method-error` and the batch goes on. Register it with `registerFitMethod` to use it by name.
 * @example registerFitMethod(defineFitMethod({ name: 'three-point', fitTrack: ({ x, y }) => ({ kappa: threePointKappa(x, y) }) }))
 */
export function defineFitMethod(spec: FitMethodSpec): CircleFitMethod {
  if (typeof spec.fitTrack !== 'function') throw msg.badArgument('fitTrack', spec.fitTrack, 'a function (track) => ({ kappa, … })');
  return Object.freeze<CircleFitMethod>({
    name: spec.name,
    summary: spec.summary ?? `user method ${spec.name}`,
    measures: 'circle' as const,
    fitTracks(hits, offsets) {
      let sigma: Float64Array | undefined;
      if (hits.errorsKnown) {
        sigma = new Float64Array(hits.weights.length);
        for (let i = 0; i < sigma.length; i++) sigma[i] = Math.sqrt(1 / hits.weights[i]);
      }
      return fitCircleBatch(hits, offsets, (span, out, k) => {
        const { from, to } = span;
        let r: TrackFitResult;
        try {
          r = spec.fitTrack({ x: hits.x.subarray(from, to), y: hits.y.subarray(from, to), sigma: sigma?.subarray(from, to) });
        } catch {
          r = { kappa: NaN, ok: false };
        }
        const good = r.ok !== false && Number.isFinite(r.kappa);
        out.kappa[k] = good ? r.kappa : NaN;
        out.phi0[k] = good ? (r.phi0 ?? NaN) : NaN;
        out.d0[k] = good ? (r.d0 ?? NaN) : NaN;
        out.xRef[k] = hits.x[from];
        out.yRef[k] = hits.y[from];
        out.chi2[k] = good ? (r.chi2 ?? NaN) : NaN;
        out.ndf[k] = r.ndf ?? to - from - 3;
        out.iterations[k] = r.iterations ?? 0;
        out.status[k] = good ? STATUS_CODE.ok : STATUS_CODE['method-error'];
        out.errorsEstimated[k] = hits.errorsKnown ? 0 : 1;
        const c = 6 * k;
        if (good && r.cov !== undefined) for (let j = 0; j < 6; j++) out.cov[c + j] = r.cov[j];
        else if (good && r.sigmaKappa !== undefined) out.cov[c] = r.sigmaKappa * r.sigmaKappa;
      });
    },
  });
}
