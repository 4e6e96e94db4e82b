// lib/track: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { measureTracks, type MeasureTracksOptions, type TrackTable } from './measureTracks.js';
export { momenta, momentumAt, radiusOfCurvatureM, transverseMomentumGeV, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './momentum.js';
export { MS_GLUCKSTERN_FACTOR, curvatureSigmaEquallySpaced, curvatureSigmaLeastSquares, glucksternCurvatureSigma, momentumResolution, multipleScatteringCurvatureSigma, type MomentumResolution, type MomentumResolutionInput } from './resolution.js';
export { resolutionBudget, resolutionBudgetColumns, type ResolutionBudgetColumns, type ResolutionBudgetOptions } from './resolutionBudget.js';
export { trackHits, type OneTrackHits } from './trackHits.js';
export { trackTableColumns } from './trackTableColumns.js';
export { pathLengthsM, meanHitSpacingM, residualRangesM } from './pathLength.js';
export { segmentCurvatures, SEGMENT_CURVATURE_DEFAULTS, type SegmentCurvatures, type SegmentCurvatureOptions, type SegmentHits } from './segmentCurvatures.js';
export { stopsInside, curvatureSlopeSignificance, STOPS_INSIDE_DEFAULTS, type FiducialBox, type StopDecision, type StopsInsideOptions } from './stopsInside.js';
export { speciesRange, ELECTRON_RANGE_SPREAD, RANGE_TABLE_ACCURACY, type SpeciesRange } from './speciesRange.js';
export { chargedSpecies, PID_SPECIES } from './chargedSpecies.js';
export { filterTrack, newFilterScratch, bendingPlaneFilter, type FilterTrack, type FilterScratch, type FilterContext, type FilterResult } from './bendingPlaneFilter.js';
export { fitHypothesis, hypothesisM2lnL, type HypothesisFit, type HypothesisContext, type HypothesisScratch } from './fitHypothesis.js';
export { identifyTrack, IDENTIFY_DEFAULTS, MIN_HITS, UNDECIDED, type IdentifyTrackOptions, type TrackIdentity, type TrackHypothesis } from './identifyTrack.js';
export { identifyTracks, type IdentifiedTracks } from './identifyTracks.js';
export { linkStopDecays, LINK_STOP_DECAYS_DEFAULTS, type LinkStopDecaysOptions, type StopDecayLinks } from './linkStopDecays.js';
export { momentumAgainstResidualRange, predictedCurvature, type MomentumAgainstRange } from './profileAlongTrack.js';
export { initialMomentumFromRange } from './initialMomentumFromRange.js';
