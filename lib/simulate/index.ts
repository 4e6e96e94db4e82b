// lib/simulate: seeded chamber simulator with truth (re-exports only).
export { seededRandom, type SeededRandom } from './rng.js';
export { chamber, insideChamber, type Chamber, type ChamberField, type ChamberOptions } from './chamber.js';
export { helixStep } from './helixStep.js';
export { transportTrack } from './transport.js';
export { TRANSPORT_DEFAULTS, type Sampling, type EnergyLossMode, type TransportOptions } from './transportOptions.js';
export type { TrackStart, TrackEnd, EndReason, HitSink, DeltaSink, PositionAndDirection, ParticleInFlight } from './trackInFlight.js';
export { rotateAbout } from './scatteringKick.js';
export type { HelixMotion } from './helixStep.js';
export { twoBodyDecay, type TwoBodyProducts } from './twoBodyDecay.js';
export { michelMaxEnergyMeV, sampleMichelFraction } from './michel.js';
export { deltaRayRatePerM, sampleDeltaRayKineticMeV, deltaRayCosTheta } from './deltaRay.js';
export { NEUTRAL_DECAYS, DECAY_AT_REST, DECAY_IN_FLIGHT } from './decays.js';
export {
  simulateChamber, simulateChamberInParts, type SimulationTotals,
  type SimulationConfig, type SimulationResult, type MeasurementModel, type TransportSettings, type Source,
  type BeamSource, type BurstSource, type CosmicSource, type StoppingSource, type TruthTable, type HitTruth,
} from './simulate.js';
export { SCENARIO_SCHEMA } from './scenarioSchema.js';
export { readScenario, parseScenario, resolveScenario, SCENARIO_DEFAULTS } from './scenario.js';
export { formatHitsCsv, formatTruthCsv, formatRunRecord, formatRunRecordTotals, TRUTH_CSV_COLUMNS, type CsvPartOptions } from './simulationCsv.js';
export { truthToDataFrame } from './truthFrame.js';
export { readTruth } from './readTruth.js';
