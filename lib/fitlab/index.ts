// lib/fitlab: compare track-fit methods on simulated truth (re-exports only).
export { fitLabSample, type FitLabSample, type FitLabSampleOptions } from './sample.js';
export { fitLabSampleFromRun, type SampleFromRunOptions } from './sampleFromRun.js';
export { compareFitters, type FitLabReport, type FitMerit, type BinnedMerit, type FitterTrackColumns, type CompareOptions } from './compare.js';
export { pullFigure, pValueFigure, meritFigure } from './figures.js';
export { fitLabTables } from './tables.js';
