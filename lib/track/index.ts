export { momenta, momentumAt, transverseMomentumGeV, radiusOfCurvatureM, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './momentum';
export { measureTracks, type MeasureTracksOptions, type TrackTable } from './measureTracks';
export { trackTableColumns } from './trackTableColumns';
export * from './highland';
export * from './resolution';
export * from './resolutionBudget';
