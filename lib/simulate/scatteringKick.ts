/**
 * Tilts the direction in state[3..5] by small projected angles (t1, t2) [rad] in two
 * perpendicular planes containing it (the two Gaussian projected angles of multiple scattering,
 * PDG RPP "Passage of particles through matter", §multiple scattering). Exact rotation: the
 * result stays a unit vector for any angle.
 */
export function scatteringKick(state: Float64Array, t1: number, t2: number): void {
  const ux = state[3], uy = state[4], uz = state[5];
  // e1 ⟂ u built from the coordinate axis least aligned with u; e2 = u × e1.
  let ex: number, ey: number, ez: number;
  if (Math.abs(ux) <= Math.abs(uy) && Math.abs(ux) <= Math.abs(uz)) { ex = 0; ey = uz; ez = -uy; }
  else if (Math.abs(uy) <= Math.abs(uz)) { ex = -uz; ey = 0; ez = ux; }
  else { ex = uy; ey = -ux; ez = 0; }
  const ne = 1 / Math.sqrt(ex * ex + ey * ey + ez * ez);
  ex *= ne; ey *= ne; ez *= ne;
  const fx = uy * ez - uz * ey, fy = uz * ex - ux * ez, fz = ux * ey - uy * ex;
  const theta = Math.sqrt(t1 * t1 + t2 * t2);
  if (theta === 0) return;
  const c = Math.cos(theta), sn = Math.sin(theta) / theta;
  state[3] = c * ux + sn * (t1 * ex + t2 * fx);
  state[4] = c * uy + sn * (t1 * ey + t2 * fy);
  state[5] = c * uz + sn * (t1 * ez + t2 * fz);
}

/**
 * Unit vector at polar angle acos(cosTheta) and azimuth `phi` [rad] about the unit vector u.
 * @example rotateAbout(0, 0, 1, 1, 0) // [0, 0, 1]
 */
export function rotateAbout(ux: number, uy: number, uz: number, cosTheta: number, phi: number): [number, number, number] {
  const s = Float64Array.of(0, 0, 0, ux, uy, uz);
  const theta = Math.acos(Math.max(-1, Math.min(1, cosTheta)));
  scatteringKick(s, theta * Math.cos(phi), theta * Math.sin(phi));
  return [s[3], s[4], s[5]];
}
