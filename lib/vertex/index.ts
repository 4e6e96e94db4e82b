// lib/vertex: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { armenteros } from './armenteros.js';
export { CLOSEST_APPROACH_DEFAULTS, circleCrossings, closestApproach, newClosestApproachScratch, refineClosestApproach, type ClosestApproach, type ClosestApproachScratch } from './closestApproach.js';
export { KINK_FINDER_DEFAULTS, findKinks, type KinkCandidates, type KinkFinderOptions, type KinkFinderResult } from './findKinks.js';
export { V0_FINDER_DEFAULTS, findV0s, type V0FinderOptions, type V0FinderResult } from './findV0s.js';
export { decayWindowInBox, fitLifetime, type LifetimeFit } from './fitLifetime.js';
export { fitMassPeak, type MassPeakFit } from './fitMassPeak.js';
export { fourMomentum, invariantMassMeV, sumFourVectors, type FourVector } from './fourVector.js';
export { arcLengthNear, helixCentre, helixPoint, helixPointJacobian, newHelixParameters, type HelixParameters } from './helixParameters.js';
export { invariantMassWithError, type MomentumWithCovariance } from './invariantMassError.js';
export { boostFourVector, toRestFrame } from './lorentzBoost.js';
export { energyLossFactor, newTrackState, trackStateAt, type TrackState, type TrackStateOptions } from './trackState.js';
export { twoBodyMomentumMeV } from './twoBodyMomentum.js';
export { fitTwoTrackVertex, nearestArcLength, newTwoTrackVertex, newVertexScratch, type TwoTrackVertex, type VertexScratch } from './twoTrackVertex.js';
export { v0CandidateColumns } from './v0CandidateColumns.js';
export { type V0Candidates } from './v0Candidates.js';
export { newV0MassScratch, v0Masses, type DaughterHypotheses, type V0MassContext } from './v0Masses.js';
export { loadHelix, transverseMomentumMeV, vertexTracks, type VertexTracks, type VertexTracksOptions } from './vertexTracks.js';
