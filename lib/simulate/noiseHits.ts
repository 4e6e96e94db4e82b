import type { Chamber } from './chamber.js';
import type { HitRecorder } from './hitRecorder.js';
import type { SeededRandom } from './rng.js';

/** Track id of noise hits: negative ids mean "on no track" in hit files (lib/track/measureTracks). */
export const NOISE_TRACK = -1;

/**
 * Adds a Poisson number (mean `meanPerEvent`) of noise hits, uniform in the chamber box [m], to
 * one event; they carry the track id NOISE_TRACK and no truth.
 */
export function addNoiseHits(hits: HitRecorder, event: number, c: Chamber, meanPerEvent: number, rng: SeededRandom): void {
  const n = meanPerEvent > 0 ? rng.poisson(meanPerEvent) : 0;
  for (let k = 0; k < n; k++) {
    hits.add(event, NOISE_TRACK,
      c.xMinM + (c.xMaxM - c.xMinM) * rng.uniform(),
      c.yMinM + (c.yMaxM - c.yMinM) * rng.uniform(),
      c.zMinM + (c.zMaxM - c.zMinM) * rng.uniform(),
      NaN, NaN, NaN, NaN);
  }
}
