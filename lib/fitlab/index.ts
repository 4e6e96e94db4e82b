// lib/fitlab: compare track-fit methods on simulated truth (re-exports only).
export {
  BUILTIN_FITTERS, KASA_FITTER, TAUBIN_FITTER, GEOMETRIC_FITTER, HELIX_FITTER, outcomeOfCircleFit,
  type Fitter, type FitterOutcome,
} from './fitter';
export { fitLabSample, type FitLabSample, type FitLabSampleOptions } from './sample';
export { fitLabSampleFromRun, type SampleFromRunOptions } from './sampleFromRun';
export { compareFitters, type FitLabReport, type FitMerit, type BinnedMerit, type FitterTrackColumns, type CompareOptions } from './compare';
export { chi2Survival, lnGamma } from './chi2Survival';
export { pullFigure, pValueFigure, meritFigure } from './figures';
export { fitLabTables } from './tables';
