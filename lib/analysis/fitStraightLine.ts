import { fitLinear } from './fitLinear.js';
import { fitModel, type FitData } from './fitModel.js';
import type { FitResult } from './fitResult.js';

export interface FitStraightLineOptions {
  /** y = slope·x, no intercept (e.g. e/m from a regression through the origin). */
  readonly throughOrigin?: boolean;
  /** Also the Δχ² = 1 profile errors. */
  readonly asymmetricErrors?: boolean;
}

/**
 * Straight-line fit y = intercept + slope·x (parameters named so), or y = slope·x with
 * `throughOrigin`. Without errors on x this is exact linear least squares (`fitLinear`);
 * with `xSigma` it is the effective-variance fit of `fitModel`, which for a straight line is
 * the maximum likelihood for Gaussian errors on both axes (D. York, Can. J. Phys. 44 (1966)
 * 1079; J. Orear, Am. J. Phys. 50 (1982) 912), errors from the curvature of that χ².
 * @example fitStraightLine({ x: voltages, y: radii2, sigma: 0.02, xSigma: 0.5 }, { throughOrigin: true }).parameters.slope
 */
export function fitStraightLine(data: FitData, options: FitStraightLineOptions = {}): FitResult {
  const origin = options.throughOrigin === true;
  if (data.xSigma === undefined && !options.asymmetricErrors) {
    return fitLinear({ columns: [data.x], y: data.y, sigma: data.sigma }, { intercept: !origin, names: origin ? ['slope'] : ['intercept', 'slope'] });
  }
  // Start from the fit that ignores the x errors.
  const first = fitLinear({ columns: [data.x], y: data.y, sigma: data.sigma }, { intercept: !origin });
  const start = first.values.every(Number.isFinite) ? [...first.values] : origin ? [1] : [0, 1];
  return origin
    ? fitModel(data, (x, p) => p[0] * x, start, { names: ['slope'], asymmetricErrors: options.asymmetricErrors })
    : fitModel(data, (x, p) => p[0] + p[1] * x, start, { names: ['intercept', 'slope'], asymmetricErrors: options.asymmetricErrors });
}
