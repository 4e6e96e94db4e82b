export { momenta, momentumAt, transverseMomentumGeV, radiusOfCurvatureM, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './momentum';
