import type { ParticleInFlight } from '../trackInFlight.js';

/** A particle made by a source at the start of an event. Position [m], unit direction, |p| [GeV/c]. */
export interface Primary extends ParticleInFlight {
  /** Label in the truth table: 'beam', 'cosmic', 'stopping', … */
  readonly process: string;
}

/** Unit vector from (x, y, z); throws nothing, returns [0, 0, 0] for the null vector. */
export function unit(x: number, y: number, z: number): [number, number, number] {
  const n = Math.hypot(x, y, z);
  return n > 0 ? [x / n, y / n, z / n] : [0, 0, 0];
}
