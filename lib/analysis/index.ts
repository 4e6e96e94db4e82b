// lib/analysis: histograms, the fitting layer, shapes and statistics helpers (named re-exports only).
export { Histogram, type HistogramBinning } from './histogram.js';
export { Histogram2D, type Histogram2DBinning } from './histogram2d.js';
export { addHistograms } from './addHistograms.js';
export { scaleHistogram, normaliseHistogram, type Normalisation } from './scaleHistogram.js';
export { binErrors, type BinErrors, type BinErrorOptions } from './binErrors.js';
export { binCounts, type BinnedCounts } from './binCounts.js';

export { fitModel, type FitData, type FitModelOptions } from './fitModel.js';
export { fitHistogram, binResidual, type BinnedMethod, type FitHistogramOptions } from './fitHistogram.js';
export { fitUnbinned, type FitUnbinnedOptions } from './fitUnbinned.js';
export { fitLinear, type LinearFitData, type FitLinearOptions } from './fitLinear.js';
export { fitStraightLine, type FitStraightLineOptions } from './fitStraightLine.js';
export { type FitResult, type FittedParameter, type ModelFitMethod, type ModelFitStatus } from './fitResult.js';
export { type ParameterStart, type ParameterOptions } from './fitParameters.js';
export {
  levenbergMarquardt, LEVENBERG_MARQUARDT_DEFAULTS,
  type ResidualProblem, type LevenbergMarquardtSettings, type LevenbergMarquardtResult, type MinimiserStatus,
} from './levenbergMarquardt.js';
export { minimizeQuasiNewton, QUASI_NEWTON_DEFAULTS, type ScalarProblem, type QuasiNewtonSettings, type QuasiNewtonResult } from './quasiNewton.js';
export { householderLeastSquares, type LinearLeastSquaresSolution } from './householderLeastSquares.js';

export { type Shape, type Model, type ModelFunction, customShape, isShape } from './shapes/shape.js';
export { gaussian } from './shapes/gaussian.js';
export { polynomial } from './shapes/polynomial.js';
export { exponential } from './shapes/exponential.js';
export { breitWigner } from './shapes/breitWigner.js';
export { voigt } from './shapes/voigt.js';
export { faddeeva } from './shapes/faddeeva.js';
export { michelSpectrum } from './shapes/michelSpectrum.js';
export { sumShapes } from './shapes/sumShapes.js';

export { poissonInterval, poissonLimit, ONE_SIGMA_CL, type PoissonInterval } from './poissonInterval.js';
export { chi2Survival } from './chi2Survival.js';
export { chi2Quantile } from './chi2Quantile.js';
export { normalCdf } from './normalCdf.js';
export { normalQuantile } from './normalQuantile.js';
export { erf, erfc } from './erf.js';
export { lnGamma } from './lnGamma.js';
export { regularizedGammaP, regularizedGammaQ } from './regularizedGamma.js';
export { weightedMean, type WeightedMean } from './weightedMean.js';
export { propagateErrors, type PropagatedErrors } from './propagateErrors.js';
export { numericalJacobian, jacobianScratch, type JacobianSettings, type JacobianScratch } from './numericalJacobian.js';
export { numericalHessian } from './numericalHessian.js';
export { michelEndpoint } from './michelEndpoint.js';
