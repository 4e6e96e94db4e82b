import type { PreparedPlaneHits } from './preparePlaneHits.js';

/**
 * One track as a fit kernel reads it: rows [from, to) of a prepared hit table. The batch loop
 * moves one span from track to track, so kernels get it without an allocation per track; a
 * kernel never keeps it.
 */
export interface TrackSpan {
  readonly hits: PreparedPlaneHits;
  from: number;
  to: number;
}
