// lib/find: track finding among unlabelled hits (re-exports only).
export { findTracks, FIND_TRACKS_DEFAULTS, type FindHits, type FindTracksOptions, type FoundTracks, type HitErrorSource } from './findTracks.js';
export { DIRECTION_RULES, type DirectionRule } from './travelDirection.js';
export { estimateHitSpacing } from './hitSpacing.js';
export { groupEvents, type EventGroups } from './groupEvents.js';
export { matchFoundTracks, MATCH_DEFAULTS, type MatchOptions, type TrackMatch } from './matchFoundTracks.js';
export { labelHits } from './labelHits.js';
