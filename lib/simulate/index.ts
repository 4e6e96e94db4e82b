// lib/simulate: seeded chamber simulator with truth (re-exports only).
export { seededRandom, type SeededRandom } from './rng';
export { VACUUM, type Medium, type SpeciesLoss } from './medium';
export { chamberMedium } from './chamberMedium';
export { chamber, insideChamber, type Chamber, type ChamberField, type ChamberOptions } from './chamber';
export { helixStep } from './helixStep';
export {
  transportTrack, rotateAbout, TRANSPORT_DEFAULTS,
  type Sampling, type EnergyLossMode, type TransportOptions, type TrackStart, type TrackEnd, type EndReason, type HitSink, type DeltaSink,
} from './transport';
export { twoBodyMomentumMeV, twoBodyDecay, invariantMassMeV, type TwoBodyProducts } from './twoBodyDecay';
export { michelMaxEnergyMeV, sampleMichelFraction } from './michel';
export { deltaRayRatePerM, sampleDeltaRayKineticMeV, deltaRayCosTheta } from './deltaRay';
export { bohrVarianceMeV2 } from './bohrStraggling';
export { NEUTRAL_DECAYS, DECAY_AT_REST, DECAY_IN_FLIGHT } from './decays';
export {
  simulateChamber,
  type SimulationConfig, type SimulationResult, type MeasurementModel, type TransportSettings, type Source,
  type BeamSource, type CosmicSource, type StoppingSource, type TruthTable, type HitTruth,
} from './simulate';
export { SCENARIO_SCHEMA } from './scenarioSchema';
export { readScenario, parseScenario, resolveScenario, SCENARIO_DEFAULTS } from './scenario';
export { formatHitsCsv, formatTruthCsv, formatRunRecord, TRUTH_CSV_COLUMNS } from './simulationCsv';
export { truthToDataFrame } from './truthFrame';
export { readTruth } from './readTruth';
