// lib/vertex: four-vectors and kinematics, helix–helix vertices, V⁰ and kink finders, lifetimes (re-exports only).
export { fourMomentum, sumFourVectors, invariantMassMeV, type FourVector } from './fourVector.js';
export { boostFourVector, toRestFrame } from './lorentzBoost.js';
export { twoBodyMomentumMeV } from './twoBodyMomentum.js';
export { armenteros } from './armenteros.js';
export { invariantMassWithError, type MomentumWithCovariance } from './invariantMassError.js';
export { helixPoint, helixPointJacobian, helixCentre, arcLengthNear, newHelixParameters, type HelixParameters } from './helixParameters.js';
export { closestApproach, refineClosestApproach, circleCrossings, newClosestApproachScratch, CLOSEST_APPROACH_DEFAULTS, type ClosestApproach, type ClosestApproachScratch } from './closestApproach.js';
export { fitTwoTrackVertex, nearestArcLength, newTwoTrackVertex, newVertexScratch, type TwoTrackVertex, type VertexScratch } from './twoTrackVertex.js';
export { vertexTracks, loadHelix, transverseMomentumMeV, type VertexTracks, type VertexTracksOptions } from './vertexTracks.js';
export { trackStateAt, energyLossFactor, newTrackState, type TrackState, type TrackStateOptions } from './trackState.js';
export { v0Masses, newV0MassScratch, type V0MassContext, type DaughterHypotheses } from './v0Masses.js';
export { findV0s, V0_FINDER_DEFAULTS, type V0FinderOptions, type V0FinderResult } from './findV0s.js';
export type { V0Candidates } from './v0Candidates.js';
export { v0CandidateColumns } from './v0CandidateColumns.js';
export { fitLifetime, decayWindowInBox, type LifetimeFit } from './fitLifetime.js';
export { fitMassPeak, type MassPeakFit } from './fitMassPeak.js';
export { findKinks, KINK_FINDER_DEFAULTS, type KinkFinderOptions, type KinkFinderResult, type KinkCandidates } from './findKinks.js';
