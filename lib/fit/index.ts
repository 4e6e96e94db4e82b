export { FIT_STATUS, allocateCircleFits, circleFitAt, type CircleFit, type CircleFitColumns, type FitStatus } from './circleFit.js';
export {
  fitCircles, fitCircle, fitCircleKasa, fitCircleTaubin, fitCircleGeometric,
  CIRCLE_METHODS, CIRCLE_FIT_DEFAULTS, type CircleMethod, type CircleFitOptions, type PlaneHits,
} from './fitCircles.js';
export { fitHelices, fitHelix, helixFitAt, arcLengths, type HelixFit, type HelixFitColumns, type SpaceHits } from './fitHelices.js';
export { fitLine, type LineFit } from './fitLine.js';
export { GEOMETRIC_FIT_DEFAULTS, type GeometricFitOptions } from './geometricCircle.js';
export { preparePlaneHits, isPreparedPlaneHits, type PreparedPlaneHits } from './preparePlaneHits.js';
