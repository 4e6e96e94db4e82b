export { momenta, momentumAt, transverseMomentumGeV, radiusOfCurvatureM, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './momentum.js';
export { measureTracks, type MeasureTracksOptions, type TrackTable } from './measureTracks.js';
export { trackTableColumns } from './trackTableColumns.js';
export { trackRows } from './trackRows.js';
export { trackHits, type OneTrackHits } from './trackHits.js';
export * from './resolution.js';
export * from './resolutionBudget.js';
