// lib/track: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { measureTracks, type MeasureTracksOptions, type TrackTable } from './measureTracks.js';
export { momenta, momentumAt, radiusOfCurvatureM, transverseMomentumGeV, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './momentum.js';
export { MS_GLUCKSTERN_FACTOR, curvatureSigmaEquallySpaced, curvatureSigmaLeastSquares, glucksternCurvatureSigma, momentumResolution, multipleScatteringCurvatureSigma, type MomentumResolution, type MomentumResolutionInput } from './resolution.js';
export { resolutionBudget, resolutionBudgetColumns, type ResolutionBudgetColumns, type ResolutionBudgetOptions } from './resolutionBudget.js';
export { trackHits, type OneTrackHits } from './trackHits.js';
export { trackTableColumns } from './trackTableColumns.js';
