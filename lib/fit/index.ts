// lib/fit: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { arcLengthsAndSlopes, newArcLengthSlopes, type ArcLengthSlopes, type CircleAt, type PointRows } from './arcLengths.js';
export { FIT_STATUS, allocateCircleFits, circleFitAt, type CircleFit, type CircleFitColumns, type FitStatus } from './circleFit.js';
export { defineFitMethod, type FitMethodSpec, type TrackFitResult, type TrackHits } from './defineFitMethod.js';
export { CIRCLE_FIT_DEFAULTS, fitCircle, fitCircles, type CircleFitOptions } from './fitCircles.js';
export { fitHelices, fitHelix, type HelixFit, type HelixFitColumns, type SpaceHits } from './fitHelices.js';
export { fitLine, type LineFit } from './fitLine.js';
export { type CircleFitMethod, type FitContext, type FitMethod, type HelixFitMethod } from './fitMethod.js';
export { BUILT_IN_FIT_METHODS, fitMethod, fitMethods, registerFitMethod } from './fitMethods.js';
export { GEOMETRIC_FIT_DEFAULTS, GEOMETRIC_METHOD, type GeometricFitOptions } from './geometricCircle.js';
export { KASA_METHOD } from './kasaCircle.js';
export { isPreparedPlaneHits, preparePlaneHits, type PlaneHits, type PreparedPlaneHits } from './preparePlaneHits.js';
export { TAUBIN_METHOD } from './taubinCircle.js';
