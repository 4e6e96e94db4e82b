import { msg } from '../errors.js';

/** One track as the mass error needs it: momentum [MeV/c], its 3×3 covariance [(MeV/c)²], a mass hypothesis [MeV]. */
export interface MomentumWithCovariance {
  /** (px, py, pz) [MeV/c]. */
  readonly pMeV: ArrayLike<number>;
  /** Row-major 3×3 covariance of (px, py, pz) [(MeV/c)²]. */
  readonly covMeV2: ArrayLike<number>;
  readonly massMeV: number;
}

/**
 * Invariant mass [MeV] of N tracks under mass hypotheses, with its error propagated to first
 * order from each track's momentum covariance (tracks taken as uncorrelated):
 *   m² = (ΣE)² − |Σp|²,  ∂m/∂p_i = (E p_i/E_i − P)/m,  σ_m² = Σ_i gᵢᵀ C_i gᵢ
 * (linear error propagation; common practice). Valid for m > 0; σ is NaN when m = 0 (the
 * derivative diverges there, as for a photon conversion with exactly collinear daughters).
 * @example invariantMassWithError([{ pMeV, covMeV2, massMeV: 139.57 }, …]).sigmaMeV
 */
export function invariantMassWithError(tracks: readonly MomentumWithCovariance[]): { readonly massMeV: number; readonly sigmaMeV: number } {
  if (tracks.length < 2) throw msg.badArgument('tracks.length', tracks.length, 'at least two tracks');
  let e = 0, x = 0, y = 0, z = 0;
  const energies = new Float64Array(tracks.length);
  tracks.forEach((t, i) => {
    const px = t.pMeV[0], py = t.pMeV[1], pz = t.pMeV[2];
    energies[i] = Math.sqrt(px * px + py * py + pz * pz + t.massMeV * t.massMeV);
    e += energies[i]; x += px; y += py; z += pz;
  });
  const m2 = e * e - x * x - y * y - z * z;
  const m = m2 > 0 ? Math.sqrt(m2) : m2 > -1e-9 * e * e ? 0 : NaN;
  let variance = 0;
  tracks.forEach((t, i) => {
    const g0 = (e * t.pMeV[0] / energies[i] - x) / m;
    const g1 = (e * t.pMeV[1] / energies[i] - y) / m;
    const g2 = (e * t.pMeV[2] / energies[i] - z) / m;
    const c = t.covMeV2;
    variance += g0 * (c[0] * g0 + c[1] * g1 + c[2] * g2) + g1 * (c[3] * g0 + c[4] * g1 + c[5] * g2) + g2 * (c[6] * g0 + c[7] * g1 + c[8] * g2);
  });
  return { massMeV: m, sigmaMeV: m > 0 ? Math.sqrt(Math.max(0, variance)) : NaN };
}
