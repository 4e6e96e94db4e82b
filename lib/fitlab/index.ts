// lib/fitlab: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { compareFitters, type BinnedMerit, type CompareOptions, type FitLabReport, type FitMerit, type FitterTrackColumns } from './compare.js';
export { meritFigure, pValueFigure, pullFigure } from './figures.js';
export { findingFigure } from './findingFigure.js';
export { findingLab, type FindingBin, type FindingLabOptions, type FindingLabReport, type FindingSummary } from './findingLab.js';
export { fitLabSample, type FitLabSample, type FitLabSampleOptions } from './sample.js';
export { fitLabSampleFromRun, type SampleFromRunOptions } from './sampleFromRun.js';
export { fitLabTables } from './tables.js';
export { withNoiseHits } from './withNoiseHits.js';
