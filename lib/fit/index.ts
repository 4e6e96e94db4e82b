export { FIT_STATUS, allocateCircleFits, circleFitAt, type CircleFit, type CircleFitColumns, type FitStatus } from './circleFit';
export {
  fitCircles, fitCircle, fitCircleKasa, fitCircleTaubin, fitCircleGeometric,
  CIRCLE_METHODS, CIRCLE_FIT_DEFAULTS, type CircleMethod, type CircleFitOptions, type PlaneHits,
} from './fitCircles';
export { fitHelices, fitHelix, helixFitAt, arcLengths, type HelixFit, type HelixFitColumns, type SpaceHits } from './fitHelices';
export { fitLine, type LineFit } from './fitLine';
export { GEOMETRIC_FIT_DEFAULTS, type GeometricFitOptions } from './geometricCircle';
export { preparePlaneHits, isPreparedPlaneHits, type PreparedPlaneHits } from './preparePlaneHits';
