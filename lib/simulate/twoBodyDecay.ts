import { msg } from '../errors.js';
import type { SeededRandom } from './rng.js';
// The one definition of p*: kinematics lives in lib/vertex; the simulator imports only its
// dependency-free leaf modules (test/architecture.test.ts holds it to that).
import { twoBodyMomentumMeV } from '../vertex/twoBodyMomentum.js';

/** Four-momenta of the two daughters in the laboratory [MeV]: (E, px, py, pz) each. */
export interface TwoBodyProducts {
  readonly first: readonly [number, number, number, number];
  readonly second: readonly [number, number, number, number];
  /** Cosine of the first daughter's rest-frame angle to the parent's flight direction. */
  readonly cosThetaStar: number;
}

/**
 * Isotropic two-body decay of a moving parent. The daughters are made back to back in the rest
 * frame with |p*| from `twoBodyMomentumMeV`, direction uniform on the sphere (a spin-0 parent, or
 * an unpolarised one), then boosted along the parent momentum (Lorentz boost; PDG RPP
 * "Kinematics"). Parent momentum in MeV/c. Throws BAD_ARGUMENT when the decay is closed.
 */
export function twoBodyDecay(
  parentMeV: number,
  pxMeV: number,
  pyMeV: number,
  pzMeV: number,
  m1MeV: number,
  m2MeV: number,
  rng: SeededRandom,
): TwoBodyProducts {
  const pStar = twoBodyMomentumMeV(parentMeV, m1MeV, m2MeV);
  if (!Number.isFinite(pStar)) throw msg.badArgument('daughter masses', [m1MeV, m2MeV], `a sum below the parent mass ${parentMeV} MeV`);
  const cosT = 2 * rng.uniform() - 1;
  const sinT = Math.sqrt(Math.max(0, 1 - cosT * cosT));
  const phi = 2 * Math.PI * rng.uniform();
  // Rest-frame direction in a frame whose z' axis is the parent flight direction.
  const p = Math.hypot(pxMeV, pyMeV, pzMeV);
  const [ex, ey, ez] = p > 0 ? [pxMeV / p, pyMeV / p, pzMeV / p] : [0, 0, 1];
  const [ax, ay, az] = perpendicular(ex, ey, ez);
  const bx = ey * az - ez * ay, by = ez * ax - ex * az, bz = ex * ay - ey * ax;
  const dx = sinT * Math.cos(phi), dy = sinT * Math.sin(phi), dz = cosT;
  const nx = dx * ax + dy * bx + dz * ex;
  const ny = dx * ay + dy * by + dz * ey;
  const nz = dx * az + dy * bz + dz * ez;
  const e1 = Math.sqrt(pStar * pStar + m1MeV * m1MeV);
  const e2 = Math.sqrt(pStar * pStar + m2MeV * m2MeV);
  const eParent = Math.sqrt(p * p + parentMeV * parentMeV);
  const gamma = eParent / parentMeV;
  const betaGamma = p / parentMeV;
  const boost = (e: number, qx: number, qy: number, qz: number): [number, number, number, number] => {
    const along = qx * ex + qy * ey + qz * ez;
    const alongLab = gamma * along + betaGamma * e;
    const eLab = gamma * e + betaGamma * along;
    return [eLab, qx + (alongLab - along) * ex, qy + (alongLab - along) * ey, qz + (alongLab - along) * ez];
  };
  return {
    first: boost(e1, pStar * nx, pStar * ny, pStar * nz),
    second: boost(e2, -pStar * nx, -pStar * ny, -pStar * nz),
    cosThetaStar: cosT,
  };
}

/** A unit vector perpendicular to the unit vector (x, y, z). */
function perpendicular(x: number, y: number, z: number): [number, number, number] {
  const ax = Math.abs(x), ay = Math.abs(y), az = Math.abs(z);
  let px: number, py: number, pz: number;
  if (ax <= ay && ax <= az) { px = 0; py = z; pz = -y; }
  else if (ay <= az) { px = -z; py = 0; pz = x; }
  else { px = y; py = -x; pz = 0; }
  const n = Math.hypot(px, py, pz);
  return [px / n, py / n, pz / n];
}
