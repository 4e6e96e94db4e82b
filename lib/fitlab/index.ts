// lib/fitlab: compare track-fit methods on simulated truth (re-exports only).
export { fitLabSample, type FitLabSample, type FitLabSampleOptions } from './sample.js';
export { fitLabSampleFromRun, type SampleFromRunOptions } from './sampleFromRun.js';
export { compareFitters, type FitLabReport, type FitMerit, type BinnedMerit, type FitterTrackColumns, type CompareOptions } from './compare.js';
export { pullFigure, pValueFigure, meritFigure } from './figures.js';
export { fitLabTables } from './tables.js';
export { withNoiseHits } from './withNoiseHits.js';
export { findingLab, type FindingLabOptions, type FindingLabReport, type FindingBin, type FindingSummary } from './findingLab.js';
export { findingFigure } from './findingFigure.js';
export { matterSample, type MatterSample, type MatterSampleOptions } from './matterSample.js';
export { matterFitLab, type MatterFitLabReport, type MatterFitLabBin, type MatterFitMerit, type MatterFitLabOptions } from './matterFitLab.js';
