// lib/fit/matter: the track fit with material effects (re-exports only).
export { fitTrackInMatter } from './fitTrackInMatter.js';
export { fitTracksInMatter, type MatterBatchFitOptions, type MatterFitColumns, type MatterTrackColumnsHits } from './fitTracksInMatter.js';
export { STOP_CONSTRAINT_SPACINGS, hitPathM, stopConstraint } from './stopConstraint.js';
export { matterFitScratch, type MatterFitScratch } from './matterFitScratch.js';
export {
  MATTER_FIT_DEFAULTS, MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY, MATTER_FIT_STATUS,
  type MatterFitOptions, type MatterFitState, type MatterFitStatus, type MatterTrackFit, type MatterTrackHits,
} from './matterTrackFit.js';
