import { msg } from '../errors.js';
import type { HitTable } from '../io/hitTable.js';
import type { Chamber } from '../simulate/chamber.js';
import type { SeededRandom } from '../simulate/rng.js';

/**
 * The hit table with noise hits added to every event so that they make `fraction` of all its
 * hits (n_noise = round(f/(1 − f)·n_hits) per event), uniform in the chamber box, track −1
 * (the hit-file convention for hits on no track), the same errors as the event's first hit.
 * The noise rows follow each run of an event's rows; no row of the input is changed or dropped.
 * @example withNoiseHits(run.hits, 0.1, config.chamber, seededRandom(3, 'noise'))
 */
export function withNoiseHits(hits: HitTable, fraction: number, box: Chamber, rng: SeededRandom): HitTable {
  if (!(fraction >= 0 && fraction < 1)) throw msg.badArgument('fraction', fraction, 'a noise fraction from 0 up to (not including) 1');
  const n = hits.length;
  const perRun = (count: number) => Math.round((fraction / (1 - fraction)) * count);
  let extra = 0;
  for (let i = 0; i < n;) {
    const first = i;
    while (i < n && hits.event[i] === hits.event[first]) i++;
    extra += perRun(i - first);
  }
  const total = n + extra;
  const col = (a: Float64Array | undefined) => (a === undefined ? undefined : new Float64Array(total));
  const out = {
    event: new Float64Array(total), track: new Float64Array(total), x: new Float64Array(total), y: new Float64Array(total),
    z: col(hits.z), sigmaX: col(hits.sigmaX), sigmaY: col(hits.sigmaY), sigmaZ: col(hits.sigmaZ),
  };
  let row = 0;
  const copy = (i: number) => {
    out.event[row] = hits.event[i]; out.track[row] = hits.track[i]; out.x[row] = hits.x[i]; out.y[row] = hits.y[i];
    if (out.z) out.z[row] = hits.z![i];
    if (out.sigmaX) out.sigmaX[row] = hits.sigmaX![i];
    if (out.sigmaY) out.sigmaY[row] = hits.sigmaY![i];
    if (out.sigmaZ) out.sigmaZ[row] = hits.sigmaZ![i];
    row++;
  };
  let i = 0;
  while (i < n) {
    const e = hits.event[i], first = i;
    while (i < n && hits.event[i] === e) copy(i++);
    const k = perRun(i - first);
    for (let q = 0; q < k; q++) {
      out.event[row] = e; out.track[row] = -1;
      out.x[row] = box.xMinM + (box.xMaxM - box.xMinM) * rng.uniform();
      out.y[row] = box.yMinM + (box.yMaxM - box.yMinM) * rng.uniform();
      if (out.z) out.z[row] = box.zMinM + (box.zMaxM - box.zMinM) * rng.uniform();
      if (out.sigmaX) out.sigmaX[row] = hits.sigmaX![first];
      if (out.sigmaY) out.sigmaY[row] = hits.sigmaY![first];
      if (out.sigmaZ) out.sigmaZ[row] = hits.sigmaZ![first];
      row++;
    }
  }
  return {
    length: total,
    ...out,
    source: { ...hits.source, file: `${hits.source.file} + ${(100 * fraction).toFixed(0)} % noise` },
  };
}
