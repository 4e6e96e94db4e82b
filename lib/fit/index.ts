// lib/fit: circle, helix and line fits on typed-array columns, and the fitter registry (re-exports only).
export { FIT_STATUS, allocateCircleFits, circleFitAt, type CircleFit, type CircleFitColumns, type FitStatus } from './circleFit.js';
export { fitCircles, fitCircle, CIRCLE_FIT_DEFAULTS, type CircleFitOptions, type PlaneHits } from './fitCircles.js';
export { fitHelices, fitHelix, type HelixFit, type HelixFitColumns, type SpaceHits } from './fitHelices.js';
export { arcLengthsAndSlopes, newArcLengthSlopes, type ArcLengthSlopes, type CircleAt, type PointRows } from './arcLengths.js';
export { fitLine, type LineFit } from './fitLine.js';
export { GEOMETRIC_FIT_DEFAULTS, GEOMETRIC_METHOD, type GeometricFitOptions } from './geometricCircle.js';
export { KASA_METHOD } from './kasaCircle.js';
export { TAUBIN_METHOD } from './taubinCircle.js';
export { preparePlaneHits, isPreparedPlaneHits, type PreparedPlaneHits } from './preparePlaneHits.js';
export { fitTrackInMatter, fitTracksInMatter, matterFitScratch, MATTER_FIT_DEFAULTS, MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY, MATTER_FIT_STATUS } from './matter/index.js';
export type { MatterFitColumns, MatterTrackColumnsHits, MatterFitScratch, MatterFitOptions, MatterFitState, MatterFitStatus, MatterTrackFit, MatterTrackHits } from './matter/index.js';
export { fitMethod, fitMethods, registerFitMethod, BUILT_IN_FIT_METHODS } from './fitMethods.js';
export { defineFitMethod, type FitMethodSpec, type TrackFitResult, type TrackHits } from './defineFitMethod.js';
export type { FitMethod, CircleFitMethod, HelixFitMethod, FitContext } from './fitMethod.js';
