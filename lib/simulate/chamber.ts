import { msg } from '../errors.js';
import type { Medium } from '../matter/medium.js';

/**
 * Magnetic field of a chamber: uniform in any direction, or a map evaluated at a point.
 * A map writes [Bx, By, Bz] in tesla into `out` for the point (x, y, z) in metres.
 */
export type ChamberField =
  | { readonly kind: 'uniform'; readonly bxT: number; readonly byT: number; readonly bzT: number }
  | { readonly kind: 'map'; readonly at: (xM: number, yM: number, zM: number, out: Float64Array) => void };

/** A box-shaped chamber filled with one medium, in a magnetic field. Lengths in metres. */
export interface Chamber {
  readonly xMinM: number;
  readonly xMaxM: number;
  readonly yMinM: number;
  readonly yMaxM: number;
  readonly zMinM: number;
  readonly zMaxM: number;
  readonly medium: Medium;
  readonly field: ChamberField;
}

export interface ChamberOptions {
  /** Full sizes along x, y, z [m]; the box is centred on the origin. */
  readonly sizeM: readonly [number, number, number];
  readonly medium: Medium;
  /** Uniform field [Bx, By, Bz] in tesla, or a field map. */
  readonly fieldT: readonly [number, number, number] | ((xM: number, yM: number, zM: number, out: Float64Array) => void);
}

/**
 * Builds a chamber centred on the origin. Throws BAD_ARGUMENT for a non-positive size or a
 * non-finite field component.
 * @example chamber({ sizeM: [1.2, 0.8, 0.5], medium: VACUUM, fieldT: [0, 0, 1.5] })
 */
export function chamber(options: ChamberOptions): Chamber {
  const [sx, sy, sz] = options.sizeM;
  for (const [name, v] of [['sizeM[0]', sx], ['sizeM[1]', sy], ['sizeM[2]', sz]] as const) {
    if (!(v > 0) || !Number.isFinite(v)) throw msg.badArgument(name, v, 'a positive length in metres');
  }
  let field: ChamberField;
  if (typeof options.fieldT === 'function') {
    field = { kind: 'map', at: options.fieldT };
  } else {
    const [bx, by, bz] = options.fieldT;
    if (![bx, by, bz].every(Number.isFinite)) throw msg.badArgument('fieldT', options.fieldT, 'three finite field components in tesla');
    field = { kind: 'uniform', bxT: bx, byT: by, bzT: bz };
  }
  return Object.freeze({
    xMinM: -sx / 2, xMaxM: sx / 2,
    yMinM: -sy / 2, yMaxM: sy / 2,
    zMinM: -sz / 2, zMaxM: sz / 2,
    medium: options.medium,
    field,
  });
}

/** True when the point lies inside the chamber box (faces included). */
export function insideChamber(c: Chamber, xM: number, yM: number, zM: number): boolean {
  return xM >= c.xMinM && xM <= c.xMaxM && yM >= c.yMinM && yM <= c.yMaxM && zM >= c.zMinM && zM <= c.zMaxM;
}
