// lib/find: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { FIND_TRACKS_DEFAULTS, findTracks, type FindHits, type FindTracksOptions, type FoundTracks, type HitErrorSource } from './findTracks.js';
export { groupEvents, type EventGroups } from './groupEvents.js';
export { estimateHitSpacing } from './hitSpacing.js';
export { labelHits } from './labelHits.js';
export { MATCH_DEFAULTS, matchFoundTracks, type MatchOptions, type TrackMatch } from './matchFoundTracks.js';
export { DIRECTION_RULES, type DirectionRule } from './travelDirection.js';
